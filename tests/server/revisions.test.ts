import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, type Client } from '../support/auth';
import { dividerSheet, dividerWithR2 } from './fixtures';
import { startTestApp, type TestApp } from './test-app';

let s: TestApp;
let ada: Client;
beforeAll(async () => {
  s = await startTestApp();
  ada = await signIn(s.app, 'ada-demo');
});
afterAll(async () => { await s?.close(); });

describe('revisions', () => {
  it('saves a named revision, lists it, shows it read-only, and restores it as a new version', async () => {
    const { body: p } = await ada.post('/api/projects').send({ title: 'Thermistor tap', sheet: dividerSheet() });
    const saved = await ada.post(`/api/projects/${p.id}/revisions`).send({ label: 'Before review' });
    expect(saved.status).toBe(201);
    expect(saved.body).toMatchObject({ label: 'Before review', kind: 'named', projectVersion: 1 });

    await ada.patch(`/api/projects/${p.id}`).send({ sheet: dividerWithR2(2200), baseVersion: 1 });
    const list = await ada.get(`/api/projects/${p.id}/revisions`);
    expect(list.body.revisions).toHaveLength(1);
    expect(list.body.revisions[0]).toMatchObject({ id: saved.body.id, label: 'Before review', createdBy: { login: 'ada-demo' } });
    expect(list.body.revisions[0].sheet).toBeUndefined();

    const view = await ada.get(`/api/projects/${p.id}/revisions/${saved.body.id}`);
    expect(view.status).toBe(200);
    expect(view.body.sheet).toEqual(dividerSheet());

    const restored = await ada.post(`/api/projects/${p.id}/revisions/${saved.body.id}/restore`).send({ baseVersion: 2 });
    expect(restored.status).toBe(200);
    expect(restored.body.project).toMatchObject({ version: 3, sheet: dividerSheet() });
    expect(restored.body.revision).toMatchObject({ kind: 'restore', restoredFrom: saved.body.id, projectVersion: 3 });

    // The restore is recorded, and so is the state it replaced (so a restore can be undone).
    const after = (await ada.get(`/api/projects/${p.id}/revisions`)).body.revisions;
    expect(after.map((r: { kind: string }) => r.kind)).toEqual(['restore', 'auto', 'named']);
    expect(after[0].label).toBe('Restored “Before review”');
    const before = await ada.get(`/api/projects/${p.id}/revisions/${after[1].id}`);
    expect(before.body.sheet.parts[2].params.resistance).toBe(2200);
    expect(before.body.projectVersion).toBe(2);
  });

  it('refuses a restore based on a stale version and changes nothing', async () => {
    const { body: p } = await ada.post('/api/projects').send({ title: 'Race', sheet: dividerSheet() });
    const { body: rev } = await ada.post(`/api/projects/${p.id}/revisions`).send({ label: 'v1' });
    await ada.patch(`/api/projects/${p.id}`).send({ sheet: dividerWithR2(1000), baseVersion: 1 });
    const res = await ada.post(`/api/projects/${p.id}/revisions/${rev.id}/restore`).send({ baseVersion: 1 });
    expect(res.status).toBe(409);
    expect(res.body.error.currentVersion).toBe(2);
    const now = await ada.get(`/api/projects/${p.id}`);
    expect(now.body.version).toBe(2);
    expect((await ada.get(`/api/projects/${p.id}/revisions`)).body.revisions).toHaveLength(1);
  });

  it('answers 404 for a revision of another project, and 400 for an empty label', async () => {
    const { body: a } = await ada.post('/api/projects').send({ title: 'A' });
    const { body: b } = await ada.post('/api/projects').send({ title: 'B' });
    const { body: rev } = await ada.post(`/api/projects/${a.id}/revisions`).send({ label: 'only in A' });
    expect((await ada.get(`/api/projects/${b.id}/revisions/${rev.id}`)).status).toBe(404);
    expect((await ada.post(`/api/projects/${b.id}/revisions/${rev.id}/restore`)).status).toBe(404);
    expect((await ada.get(`/api/projects/${b.id}/revisions/nope`)).status).toBe(404);
    expect((await ada.post(`/api/projects/${a.id}/revisions`).send({ label: '' })).status).toBe(400);
  });
});
