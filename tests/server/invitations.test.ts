import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq, sql } from 'drizzle-orm';
import { invitations, memberships } from '../../server/db/schema';
import { createApp } from '../../server/app';
import { signIn, type Client } from '../support/auth';
import { startTestApp, type TestApp } from './test-app';

let s: TestApp;
let ada: Client;
let ben: Client;
let chen: Client;
beforeAll(async () => {
  s = await startTestApp();
  [ada, ben, chen] = await Promise.all(['ada-demo', 'ben-demo', 'chen-demo'].map((l) => signIn(s.app, l)));
});
afterAll(async () => { await s?.close(); });

async function newProject(owner: Client, title = 'Shared bench') {
  return (await owner.post('/api/projects').send({ title })).body as { id: string; title: string };
}

/** The accept link in the newest message to `to`, read from the SMTP sink. */
async function linkFor(to: string): Promise<string> {
  const msg = (await s.mailbox()).find((m) => m.rcptTo.includes(to));
  expect(msg, `a message to ${to} in the sink`).toBeDefined();
  const m = /https?:\/\/\S+\/invitations\/([A-Za-z0-9_-]+)/.exec(msg!.text);
  expect(m).not.toBeNull();
  return m![0];
}
const tokenOf = (link: string) => link.split('/invitations/')[1];

describe('invitations by e-mail', () => {
  it('sends an e-mail through SMTP to the sink with a link that adds the member with the invited role', async () => {
    const p = await newProject(ada, 'Bias network review');
    const res = await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'Ben-Demo@Tapline.local', role: 'editor' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: 'ben-demo@tapline.local', role: 'editor' });

    const [msg] = await s.mailbox();
    expect(msg.rcptTo).toEqual(['ben-demo@tapline.local']);
    expect(msg.mailFrom).toBe('no-reply@tapline.local');
    expect(msg.subject).toBe('Invitation to "Bias network review" on Tapline');
    expect(msg.text).toContain('Ada Okafor (demo) invited you');
    const link = await linkFor('ben-demo@tapline.local');
    // The link points at the app's client route, on the origin the request came to.
    expect(link).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/invitations\//);

    const info = await request(s.app).get(`/api/invitations/${tokenOf(link)}`);
    expect(info.body).toMatchObject({ projectTitle: 'Bias network review', role: 'editor', status: 'pending', invitedBy: { login: 'ada-demo' } });
    expect(info.body.projectId).toBeUndefined();

    expect((await ben.get(`/api/projects/${p.id}`)).status).toBe(404);
    const accept = await ben.post(`/api/invitations/${tokenOf(link)}/accept`);
    expect(accept.status).toBe(200);
    expect(accept.body).toEqual({ projectId: p.id, role: 'editor' });
    const now = await ben.get(`/api/projects/${p.id}`);
    expect(now.status).toBe(200);
    expect(now.body.role).toBe('editor');
  });

  it('works once', async () => {
    const p = await newProject(ada);
    await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'once@example.test', role: 'viewer' });
    const token = tokenOf(await linkFor('once@example.test'));
    expect((await chen.post(`/api/invitations/${token}/accept`)).status).toBe(200);
    const again = await ben.post(`/api/invitations/${token}/accept`);
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('invitation_used');
    expect((await ben.get(`/api/projects/${p.id}`)).status).toBe(404);
    expect((await request(s.app).get(`/api/invitations/${token}`)).body.status).toBe('accepted');
  });

  it('expires', async () => {
    const p = await newProject(ada);
    await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'late@example.test', role: 'editor' });
    const token = tokenOf(await linkFor('late@example.test'));
    await s.t.database.db.update(invitations).set({ expiresAt: sql`now() - interval '1 minute'` }).where(eq(invitations.projectId, p.id));
    const res = await ben.post(`/api/invitations/${token}/accept`);
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('invitation_expired');
    expect(await s.t.database.db.select().from(memberships).where(eq(memberships.projectId, p.id))).toHaveLength(1);
  });

  it('stores only a hash of the token', async () => {
    const p = await newProject(ada);
    await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'hash@example.test', role: 'viewer' });
    const token = tokenOf(await linkFor('hash@example.test'));
    const rows = await s.t.database.db.select().from(invitations).where(eq(invitations.projectId, p.id));
    expect(rows[0].tokenHash).not.toContain(token);
    expect(rows[0].tokenHash).toMatch(/^[0-9a-f]{64}$/);
  });

  it('never lowers the role of someone who is already a member', async () => {
    const p = await newProject(ada);
    await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'ben-demo@tapline.local', role: 'editor' });
    await ben.post(`/api/invitations/${tokenOf(await linkFor('ben-demo@tapline.local'))}/accept`);
    await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'ben-demo@tapline.local', role: 'viewer' });
    const res = await ben.post(`/api/invitations/${tokenOf(await linkFor('ben-demo@tapline.local'))}/accept`);
    expect(res.body.role).toBe('editor');
  });

  it('lists and revokes pending invitations', async () => {
    const p = await newProject(ada);
    const { body: inv } = await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'pending@example.test', role: 'viewer' });
    const list = await ada.get(`/api/projects/${p.id}/invitations`);
    expect(list.body.invitations).toEqual([expect.objectContaining({ id: inv.id, email: 'pending@example.test', role: 'viewer' })]);
    expect((await ada.del(`/api/projects/${p.id}/invitations/${inv.id}`)).status).toBe(204);
    const token = tokenOf(await linkFor('pending@example.test'));
    expect((await ben.post(`/api/invitations/${token}/accept`)).status).toBe(404);
  });

  it('validates the address and the role', async () => {
    const p = await newProject(ada);
    const bad = await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'not an address', role: 'editor' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('email');
    const role = await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'x@example.test', role: 'admin' });
    expect(role.body.error.field).toBe('role');
  });

  it('needs sign-in to accept, and answers 404 for a made-up token', async () => {
    const anon = await request(s.app).post('/api/invitations/abcdefghijklmnopqrstuvwxyz/accept');
    expect(anon.status).toBe(403); // no session, so no CSRF token either
    expect((await ben.post('/api/invitations/abcdefghijklmnopqrstuvwxyz012345/accept')).status).toBe(404);
    expect((await request(s.app).get('/api/invitations/short')).status).toBe(404);
  });

  it('shows what the sink received on the developer mailbox page, escaped', async () => {
    const p = await newProject(ada, '<img src=x onerror=alert(1)> divider');
    await ada.post(`/api/projects/${p.id}/invitations`).send({ email: 'page@example.test', role: 'viewer' });
    const page = await request(s.app).get('/dev/mailbox');
    expect(page.status).toBe(200);
    expect(page.text).toContain('page@example.test');
    expect(page.text).not.toContain('<img src=x');
    expect(page.text).toContain('&lt;img src=x');
    const json = await request(s.app).get('/dev/mailbox.json');
    expect(json.body.messages[0].rcptTo).toEqual(['page@example.test']);
  });
});

describe('invitation limits and configuration', () => {
  it('limits how many invitations one user sends per hour', async () => {
    const limited = await startTestApp({ RATE_LIMIT_INVITATIONS: '2' });
    try {
      const owner = await signIn(limited.app, 'ada-demo');
      const { body: p } = await owner.post('/api/projects').send({ title: 'Limits' });
      for (let i = 0; i < 2; i++) expect((await owner.post(`/api/projects/${p.id}/invitations`).send({ email: `n${i}@example.test`, role: 'viewer' })).status).toBe(201);
      const third = await owner.post(`/api/projects/${p.id}/invitations`).send({ email: 'n3@example.test', role: 'viewer' });
      expect(third.status).toBe(429);
      expect(third.body.error.code).toBe('rate_limited');
      expect((await limited.mailbox()).map((m) => m.rcptTo[0])).not.toContain('n3@example.test');
    } finally {
      await limited.close();
    }
  });

  it('answers 503 when no mail is configured, and mounts no mailbox', async () => {
    const app = createApp({ config: s.config, database: s.t.database });
    const owner = await signIn(app, 'ada-demo');
    const { body: p } = await owner.post('/api/projects').send({ title: 'No mail' });
    const res = await owner.post(`/api/projects/${p.id}/invitations`).send({ email: 'x@example.test', role: 'viewer' });
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('mail_unavailable');
    expect(await s.t.database.db.select().from(invitations).where(eq(invitations.projectId, p.id))).toHaveLength(0);
    expect((await request(app).get('/dev/mailbox')).status).toBe(404);
  });
});
