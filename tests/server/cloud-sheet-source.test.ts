// The client's cloud sheet source (src/cloud/cloudSheetSource.ts) against the real server: the
// browser's fetch is stood in for by Node's own fetch with a cookie jar and the server's origin.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryClient } from '@tanstack/react-query';
import { createCloudSheetSource, createRevisionSheetSource, createSharedSheetSource } from '../../src/cloud/cloudSheetSource';
import { resetCsrf } from '../../src/lib/api';
import { queryKeys } from '../../src/lib/queryKeys';
import type { Sheet } from '../../shared/sheet/schema';
import { signIn } from '../support/auth';
import { dividerSheet, dividerWithR2 } from './fixtures';
import { startTestApp, type TestApp } from './test-app';

let s: TestApp;
let server: http.Server;
let base: string;
const realFetch = globalThis.fetch;

/** Makes relative fetches go to the test server, with one signed-in person's cookies. */
async function browserAs(login: string): Promise<void> {
  let cookie = '';
  const f = async (input: string | URL | Request, init: RequestInit = {}) => {
    const headers = new Headers(init.headers);
    if (cookie) headers.set('Cookie', cookie);
    const res = await realFetch(new URL(String(input), base), { ...init, headers, redirect: 'manual' });
    const set = res.headers.getSetCookie().find((c) => c.startsWith('tapline.sid='));
    if (set) cookie = set.split(';')[0];
    return res;
  };
  globalThis.fetch = f as typeof fetch;
  resetCsrf();
  let res = await f(`/auth/github?login=${login}`);
  while (res.status === 302) res = await f(res.headers.get('location')!);
}

beforeAll(async () => {
  s = await startTestApp();
  server = http.createServer(s.app);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  globalThis.fetch = realFetch;
  server?.closeAllConnections();
  await new Promise((r) => server?.close(r));
  await s?.close();
});

async function projectWithViewer() {
  const ada = await signIn(s.app, 'ada-demo');
  const chen = await signIn(s.app, 'chen-demo');
  const { body: p } = await ada.post('/api/projects').send({ title: 'Source test', sheet: dividerSheet() });
  await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'chen-demo@tapline.local', role: 'viewer' });
  const token = /\/invitations\/([A-Za-z0-9_-]+)/.exec((await s.mailbox())[0].text)![1];
  await chen.post(`/api/invitations/${token}/accept`);
  return { ada, id: p.id as string };
}

describe('cloud sheet source', () => {
  it('loads a project for an owner as editable, saves with baseVersion and updates the cache', async () => {
    const { id } = await projectWithViewer();
    await browserAs('ada-demo');
    const qc = new QueryClient();
    const src = createCloudSheetSource(id, qc);
    expect(src.key).toBe(`cloud-${id}`);
    const loaded = await src.load();
    expect(loaded).toMatchObject({ readOnly: false, title: 'Source test', version: 1 });
    // parseSheet filled in the defaults (tolerance of a resistor is 1 %, sheet-format contract).
    expect((loaded.sheet.parts[1].params as { tolerance: number }).tolerance).toBe(0.01);

    const edited = dividerWithR2(6800) as unknown as Sheet;
    const saved = await src.save!(edited, { title: 'Source test', baseVersion: loaded.version, reason: 'autosave' });
    expect(saved.version).toBe(2);
    expect((qc.getQueryData(queryKeys.projects.detail(id)) as { version: number }).version).toBe(2);
    const again = await createCloudSheetSource(id, new QueryClient()).load();
    expect((again.sheet.parts[2].params as { resistance: number }).resistance).toBe(6800);

    await expect(src.save!(edited, { title: 'x', baseVersion: 1, reason: 'explicit' })).rejects.toThrow(/someone else saved this project meanwhile \(it is now at version 2\)/);
  });

  it('gives a viewer the sheet read-only, with no save at all', async () => {
    const { id } = await projectWithViewer();
    await browserAs('chen-demo');
    const src = createCloudSheetSource(id, new QueryClient());
    expect(src.save).toBeDefined(); // not known before loading
    const loaded = await src.load();
    expect(loaded.readOnly).toBe(true);
    expect(loaded.notice).toMatch(/view only/);
    expect(src.save).toBeUndefined();
  });

  it('explains a save refused because the role was lowered meanwhile', async () => {
    const { ada, id } = await projectWithViewer();
    const chen = (await ada.get(`/api/projects/${id}/members`)).body.members.find((m: { login: string }) => m.login === 'chen-demo');
    await ada.patch(`/api/projects/${id}/members/${chen.userId}`).send({ role: 'editor' });
    await browserAs('chen-demo');
    const src = createCloudSheetSource(id, new QueryClient());
    const loaded = await src.load();
    expect(loaded.readOnly).toBe(false);
    await ada.patch(`/api/projects/${id}/members/${chen.userId}`).send({ role: 'viewer' });
    await expect(src.save!(loaded.sheet, { title: 'x', baseVersion: 1, reason: 'autosave' })).rejects.toThrow(/can no longer edit this project/);
  });

  it('fails to load a project the person is not in with a readable message', async () => {
    const { id } = await projectWithViewer();
    await browserAs('ben-demo');
    await expect(createCloudSheetSource(id, new QueryClient()).load()).rejects.toThrow(/No such project, or it is not shared with you/);
  });

  it('opens a share link and a saved revision read-only', async () => {
    const { ada, id } = await projectWithViewer();
    const { body: share } = await ada.put(`/api/projects/${id}/share`).send({ enabled: true });
    const { body: rev } = await ada.post(`/api/projects/${id}/revisions`).send({ label: 'Checked' });
    await browserAs('ben-demo');
    const shared = await createSharedSheetSource(share.token, new QueryClient()).load();
    expect(shared).toMatchObject({ readOnly: true, title: 'Source test' });
    await browserAs('ada-demo');
    const revision = await createRevisionSheetSource(id, rev.id, new QueryClient()).load();
    expect(revision).toMatchObject({ readOnly: true, title: 'Checked', version: 1 });
  });
});
