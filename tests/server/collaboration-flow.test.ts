// One story end to end, as two colleagues would live it: sign in, create, invite by e-mail
// (the link read from the SMTP sink), accept, edit, save a revision, restore, share, hand over.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { signIn, type Client } from '../support/auth';
import { dividerSheet, dividerWithR2 } from './fixtures';
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

describe('two colleagues on one project', () => {
  it('create → invite → accept → edit → revise → restore → share → hand over → leave', async () => {
    const { body: p } = await ada.post('/api/projects').send({ title: 'Soil probe front end (demo)', sheet: dividerSheet() });

    await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'ben-demo@tapline.local', role: 'editor' });
    const mail = (await s.mailbox())[0];
    const link = /\/invitations\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];
    expect((await ben.post(`/api/invitations/${link}/accept`)).body.role).toBe('editor');

    const members = (await ada.get(`/api/projects/${p.id}/members`)).body.members;
    expect(members.map((m: { login: string; role: string }) => [m.login, m.role])).toEqual([['ada-demo', 'owner'], ['ben-demo', 'editor']]);

    const edit = await ben.patch(`/api/projects/${p.id}`).send({ sheet: dividerWithR2(3300), baseVersion: 1 });
    expect(edit.body.version).toBe(2);
    const seen = await ada.get(`/api/projects/${p.id}`);
    expect(seen.body.sheet.parts[2].params.resistance).toBe(3300);
    expect(seen.body.updatedBy.login).toBe('ben-demo');

    const { body: rev } = await ben.post(`/api/projects/${p.id}/revisions`).send({ label: '3k3 tap' });
    await ada.patch(`/api/projects/${p.id}`).send({ sheet: dividerWithR2(1000), baseVersion: 2 });
    const restored = await ben.post(`/api/projects/${p.id}/revisions/${rev.id}/restore`).send({});
    expect(restored.body.project.version).toBe(4);
    expect(restored.body.project.sheet.parts[2].params.resistance).toBe(3300);

    // An editor cannot share or rename; the owner can.
    expect((await ben.put(`/api/projects/${p.id}/share`).send({ enabled: true })).status).toBe(403);
    const share = await ada.put(`/api/projects/${p.id}/share`).send({ enabled: true });
    expect((await request(s.app).get(`/api/shared/${share.body.token}`)).body.version).toBe(4);

    // The last owner can neither step down nor leave; after a hand-over they can.
    expect((await ada.patch(`/api/projects/${p.id}/members/${ada.user!.id}`).send({ role: 'editor' })).status).toBe(409);
    expect((await ada.del(`/api/projects/${p.id}/members/${ada.user!.id}`)).body.error.code).toBe('last_owner');
    expect((await ada.patch(`/api/projects/${p.id}/members/${ben.user!.id}`).send({ role: 'owner' })).body.role).toBe('owner');
    expect((await ada.del(`/api/projects/${p.id}/members/${ada.user!.id}`)).status).toBe(204);
    expect((await ada.get(`/api/projects/${p.id}`)).status).toBe(404);
    expect((await ben.get(`/api/projects/${p.id}`)).body.role).toBe('owner');
    expect((await ben.patch(`/api/projects/${p.id}/members/99999`).send({ role: 'viewer' })).status).toBe(404);
  });
});
