import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { signIn, type Client } from '../support/auth';
import { dividerSheet } from './fixtures';
import { startTestApp, type TestApp } from './test-app';

let s: TestApp;
let ada: Client;
let ben: Client;
beforeAll(async () => {
  s = await startTestApp();
  ada = await signIn(s.app, 'ada-demo');
  ben = await signIn(s.app, 'ben-demo');
});
afterAll(async () => { await s?.close(); });

const file = (obj: unknown) => Buffer.from(typeof obj === 'string' ? obj : JSON.stringify(obj));

describe('import and export', () => {
  it('imports a sheet file as a new project titled from the sheet, and exports it back', async () => {
    const res = await ada.post('/api/projects/import').attach('file', file(dividerSheet('Battery tap')), 'tap.tapline.json');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ title: 'Battery tap', role: 'owner', version: 1 });
    const out = await ada.get(`/api/projects/${res.body.id}/export`);
    expect(out.status).toBe(200);
    expect(out.headers['content-type']).toMatch(/application\/json/);
    expect(out.headers['content-disposition']).toBe('attachment; filename="battery-tap.tapline.json"');
    expect(JSON.parse(out.text)).toEqual(dividerSheet('Battery tap'));
  });

  it('takes the title from the form field, else the file name', async () => {
    const named = await ada.post('/api/projects/import').field('title', 'From the form').attach('file', file(dividerSheet()), 'x.json');
    expect(named.body.title).toBe('From the form');
    const { title: _t, ...untitled } = dividerSheet();
    const fromName = await ada.post('/api/projects/import').attach('file', file(untitled), 'ldr front end.tapline.json');
    expect(fromName.body.title).toBe('ldr front end');
  });

  it('explains a file that is not JSON, not a sheet, too large, or missing', async () => {
    const notJson = await ada.post('/api/projects/import').attach('file', file('R1 1 2 10k'), 'net.txt');
    expect(notJson.status).toBe(400);
    expect(notJson.body.error.code).toBe('invalid_file');
    expect(notJson.body.error.message).toMatch(/net\.txt.*not a JSON file/);

    const bad = dividerSheet();
    bad.wires.push({ from: 'R9.a', to: 'R1.a' });
    const notSheet = await ada.post('/api/projects/import').attach('file', file(bad), 'bad.json');
    expect(notSheet.status).toBe(400);
    expect(notSheet.body.error.code).toBe('invalid_sheet');
    expect(notSheet.body.error.message).toMatch(/R9/);
    expect(notSheet.body.error.field).toBe('file.wires[4].from');

    const big = await ada.post('/api/projects/import').attach('file', Buffer.alloc(1024 * 1024 + 10, 32), 'big.json');
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe('file_too_large');

    const none = await ada.post('/api/projects/import').field('title', 'nothing');
    expect(none.status).toBe(400);
    expect(none.body.error.code).toBe('file_missing');

    expect((await ada.get('/api/projects')).body.projects.map((p: { title: string }) => p.title)).not.toContain('nothing');
  });

  it('needs sign-in to import, and membership to export', async () => {
    const { body: p } = await ada.post('/api/projects').send({ title: 'Private', sheet: dividerSheet() });
    expect((await ben.get(`/api/projects/${p.id}/export`)).status).toBe(404);
    const anon = request.agent(s.app);
    const token = (await anon.get('/api/csrf')).body.token;
    const res = await anon.post('/api/projects/import').set('X-CSRF-Token', token).attach('file', file(dividerSheet()), 'x.json');
    expect(res.status).toBe(401);
  });
});

describe('read-only share link', () => {
  it('is off by default, turned on and off by the owner, and old links die', async () => {
    const { body: p } = await ada.post('/api/projects').send({ title: 'Review copy', sheet: dividerSheet() });
    const on = await ada.put(`/api/projects/${p.id}/share`).send({ enabled: true });
    expect(on.status).toBe(200);
    expect(on.body.enabled).toBe(true);
    const token = on.body.token as string;
    expect(token.length).toBeGreaterThanOrEqual(32);
    expect((await ada.put(`/api/projects/${p.id}/share`).send({ enabled: true })).body.token).toBe(token);

    const shared = await request(s.app).get(`/api/shared/${token}`);
    expect(shared.status).toBe(200);
    expect(shared.body).toMatchObject({ title: 'Review copy', version: 1, readOnly: true, sheet: dividerSheet() });
    expect(shared.body.id).toBeUndefined();
    expect((await ada.get(`/api/projects/${p.id}`)).body.share).toEqual({ enabled: true, token });
    // The link reads; it gives no membership.
    expect((await ben.get(`/api/projects/${p.id}`)).status).toBe(404);

    const off = await ada.put(`/api/projects/${p.id}/share`).send({ enabled: false });
    expect(off.body).toEqual({ enabled: false, token: null });
    expect((await request(s.app).get(`/api/shared/${token}`)).status).toBe(404);
    const again = await ada.put(`/api/projects/${p.id}/share`).send({ enabled: true });
    expect(again.body.token).not.toBe(token);
  });
});
