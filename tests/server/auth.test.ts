import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq, sql } from 'drizzle-orm';
import { users } from '../../server/db/schema';
import express from 'express';
import { createApp, sessionHandlersOf } from '../../server/app';
import { loadConfig } from '../../server/config';
import { fetchCsrf, signIn, signInAgent } from '../support/auth';
import { startTestApp, type TestApp } from './test-app';

let s: TestApp;
beforeAll(async () => { s = await startTestApp(); });
afterAll(async () => { await s?.close(); });

function sessionCookie(res: request.Response): string | undefined {
  const all = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  return all.find((c) => c.startsWith('tapline.sid='));
}
const sid = (cookie: string) => decodeURIComponent(cookie.split(';')[0].split('=')[1]).replace(/^s:/, '').split('.')[0];
const sessionRows = async (id: string) =>
  (await s.t.database.db.execute(sql`select count(*)::int as n from session where sid = ${id}`)).rows[0].n as number;

describe('signing in through the fake provider', () => {
  it('follows plain redirects: app → fake authorize → callback → returnTo', async () => {
    const agent = request.agent(s.app);
    const { hops } = await signInAgent(agent, 'ada-demo', '/projects/abc');
    expect(hops[0]).toMatch(/^\/fake-oauth\/authorize\?/);
    const authorize = new URL(hops[0], 'http://x');
    expect(authorize.searchParams.get('login')).toBe('ada-demo');
    expect(authorize.searchParams.get('scope')).toBe('user:email');
    expect(authorize.searchParams.get('state')).toBeTruthy();
    expect(hops[1]).toMatch(/^\/auth\/github\/callback\?code=/);
    expect(hops[2]).toBe('/projects/abc');
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ login: 'ada-demo', name: 'Ada Okafor (demo)', email: 'ada-demo@tapline.local' });
  });

  it('stores the user with provider id, login, name, e-mail and avatar', async () => {
    await signIn(s.app, 'new-person');
    const [row] = await s.t.database.db.select().from(users).where(eq(users.login, 'new-person'));
    expect(row).toMatchObject({ provider: 'github', providerId: 'fake-new-person', name: 'new-person', email: 'new-person@fake.tapline.local' });
    expect(row.avatarUrl).toBe('/fake-oauth/avatars/new-person.svg');
    // Signing in again updates the same row instead of adding one.
    await signIn(s.app, 'new-person');
    expect(await s.t.database.db.select().from(users).where(eq(users.login, 'new-person'))).toHaveLength(1);
  });

  it('answers 401 on /api/me when nobody is signed in', async () => {
    const res = await request(s.app).get('/api/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('signed_out');
  });

  it('sets an httpOnly, SameSite=Lax cookie and regenerates the session id on sign-in', async () => {
    const agent = request.agent(s.app);
    const before = sessionCookie(await agent.get('/api/csrf'));
    expect(before).toBeDefined();
    expect(before).toMatch(/HttpOnly/i);
    expect(before).toMatch(/SameSite=Lax/i);
    expect(before).not.toMatch(/Secure/i);
    const oldSid = sid(before!);
    expect(await sessionRows(oldSid)).toBe(1);

    const start = await agent.get('/auth/github?login=ben-demo');
    const cb = await agent.get(start.headers.location);
    const done = await agent.get(cb.headers.location);
    const after = sessionCookie(done);
    expect(after).toBeDefined();
    expect(sid(after!)).not.toBe(oldSid);
    expect(await sessionRows(oldSid)).toBe(0);
    expect((await agent.get('/api/me')).body.login).toBe('ben-demo');
  });

  it('marks the cookie Secure in production', async () => {
    const config = loadConfig({
      DATABASE_URL: s.t.url, NODE_ENV: 'production', SESSION_SECRET: 'a-long-random-production-secret-value',
      PUBLIC_URL: 'https://tapline.example.test', TAPLINE_ALLOW_FAKE_OAUTH: '1',
    });
    const app = createApp({ config, database: s.t.database });
    const res = await request(app).get('/api/csrf').set('X-Forwarded-Proto', 'https');
    expect(sessionCookie(res)).toMatch(/;\s*Secure/i);
  });
});

describe('sign-out', () => {
  it('needs the CSRF token, then ends the session for good', async () => {
    const agent = request.agent(s.app);
    const { cookie } = await signInAgent(agent, 'chen-demo');
    const csrf = await fetchCsrf(agent);
    const refused = await agent.post('/auth/logout');
    expect(refused.status).toBe(403);
    expect((await agent.get('/api/me')).status).toBe(200);

    expect(await sessionRows(sid(cookie))).toBe(1);
    const res = await agent.post('/auth/logout').set('X-CSRF-Token', csrf);
    expect(res.status).toBe(204);
    expect(sessionCookie(res)).toMatch(/Expires=Thu, 01 Jan 1970/);
    expect((await agent.get('/api/me')).status).toBe(401);
    // Replaying the old cookie does not bring the session back: its row is gone.
    expect(await sessionRows(sid(cookie))).toBe(0);
    const replay = await request(s.app).get('/api/me').set('Cookie', cookie);
    expect(replay.status).toBe(401);
  });
});

describe('the fake provider itself', () => {
  it('shows a page to pick or type a demo user when no login is given', async () => {
    const res = await request(s.app).get('/fake-oauth/authorize?client_id=tapline-fake-client&redirect_uri=%2Fauth%2Fgithub%2Fcallback&state=xyz');
    expect(res.status).toBe(200);
    expect(res.type).toBe('text/html');
    for (const login of ['ada-demo', 'ben-demo', 'chen-demo']) expect(res.text).toContain(`data-login="${login}"`);
    expect(res.text).toContain('name="login"');
  });

  it('refuses a redirect_uri other than the app callback (no open redirect)', async () => {
    const res = await request(s.app).get('/fake-oauth/authorize?client_id=tapline-fake-client&redirect_uri=https%3A%2F%2Fevil.example%2Fsteal&login=ada-demo');
    expect(res.status).toBe(400);
  });

  it('escapes a typed login it rejects', async () => {
    const res = await request(s.app).get('/fake-oauth/authorize?client_id=tapline-fake-client&redirect_uri=%2Fauth%2Fgithub%2Fcallback&login=%3Cscript%3Ealert(1)%3C%2Fscript%3E');
    expect(res.status).toBe(400);
    expect(res.text).not.toContain('<script>alert(1)</script>');
    expect(res.text).toContain('&lt;script&gt;');
  });

  it('answers the token, user and e-mail endpoints like the provider', async () => {
    const agent = request.agent(s.app);
    const auth = await agent.get('/fake-oauth/authorize?client_id=tapline-fake-client&redirect_uri=%2Fauth%2Fgithub%2Fcallback&login=ben-demo');
    const code = new URL(auth.headers.location, 'http://x').searchParams.get('code')!;
    const bad = await agent.post('/fake-oauth/access_token').type('form').send({ client_id: 'tapline-fake-client', client_secret: 'wrong', code });
    expect(bad.status).toBe(401);
    const tok = await agent.post('/fake-oauth/access_token').type('form').send({ client_id: 'tapline-fake-client', client_secret: 'tapline-fake-secret', code, redirect_uri: '/auth/github/callback' });
    expect(tok.status).toBe(200);
    expect(tok.body.token_type).toBe('bearer');
    // A code works once.
    const again = await agent.post('/fake-oauth/access_token').type('form').send({ client_id: 'tapline-fake-client', client_secret: 'tapline-fake-secret', code });
    expect(again.status).toBe(400);
    const user = await agent.get('/fake-oauth/user').set('Authorization', `token ${tok.body.access_token}`);
    expect(user.body).toMatchObject({ id: 'demo-1002', login: 'ben-demo' });
    const emails = await agent.get('/fake-oauth/user/emails').set('Authorization', `Bearer ${tok.body.access_token}`);
    expect(emails.body).toEqual([{ email: 'ben-demo@tapline.local', primary: true, verified: true, visibility: 'public' }]);
    expect((await agent.get('/fake-oauth/user')).status).toBe(401);
  });

  it('redirects a callback with a bad code or a forged state to the sign-in page, not a 500', async () => {
    const agent = request.agent(s.app);
    const start = await agent.get('/auth/github?login=ada-demo');
    const state = new URL(start.headers.location, 'http://x').searchParams.get('state');
    const badCode = await agent.get(`/auth/github/callback?code=nope&state=${state}`);
    expect(badCode.status).toBe(302);
    expect(badCode.headers.location).toBe('/sign-in?error=provider');
    const forged = await agent.get('/auth/github/callback?code=nope&state=forged');
    expect(forged.headers.location).toBe('/sign-in?error=state');
    const cancelled = await agent.get('/auth/github/callback?error=access_denied');
    expect(cancelled.headers.location).toBe('/sign-in?error=cancelled');
    expect((await agent.get('/api/me')).status).toBe(401);
  });

  it('never sends the user off-site after sign-in', async () => {
    const agent = request.agent(s.app);
    const { hops } = await signInAgent(agent, 'ada-demo', '//evil.example/x');
    expect(hops[2]).toBe('/projects');
  });

  it('tells the sign-in page which provider is in use', async () => {
    const res = await request(s.app).get('/api/auth/providers');
    expect(res.body).toEqual({ mode: 'fake', demoLogins: ['ada-demo', 'ben-demo', 'chen-demo'] });
  });
});

describe('session handlers for other transports', () => {
  it('resolve the signed-in user from the session cookie outside the app’s own routes', async () => {
    const agent = request.agent(s.app);
    const { cookie } = await signInAgent(agent, 'chen-demo');
    const other = express();
    other.use(sessionHandlersOf(s.app));
    other.get('/who', (req, res) => { res.json(req.user ?? null); });
    expect((await request(other).get('/who').set('Cookie', cookie)).body).toMatchObject({ login: 'chen-demo' });
    expect((await request(other).get('/who')).body).toBeNull();
  });
});

describe('with a hosted OAuth app configured', () => {
  it('uses the real provider and does not mount the fake', async () => {
    const config = loadConfig({ DATABASE_URL: s.t.url, NODE_ENV: 'test', GITHUB_CLIENT_ID: 'Iv1.test', GITHUB_CLIENT_SECRET: 'shh', PUBLIC_URL: 'http://127.0.0.1:5173' });
    const app = createApp({ config, database: s.t.database });
    expect((await request(app).get('/fake-oauth/authorize?login=ada-demo')).status).toBe(404);
    const start = await request(app).get('/auth/github');
    expect(start.status).toBe(302);
    const to = new URL(start.headers.location);
    expect(to.origin + to.pathname).toBe('https://github.com/login/oauth/authorize');
    expect(to.searchParams.get('client_id')).toBe('Iv1.test');
    expect(to.searchParams.get('redirect_uri')).toBe('http://127.0.0.1:5173/auth/github/callback');
    expect((await request(app).get('/api/auth/providers')).body.mode).toBe('github');
  });
});

describe('sign-in rate limit', () => {
  it('answers 429 after RATE_LIMIT_SIGNIN attempts from one address', async () => {
    const config = loadConfig({ DATABASE_URL: s.t.url, NODE_ENV: 'test', RATE_LIMIT_SIGNIN: '3' });
    const app = createApp({ config, database: s.t.database });
    const agent = request.agent(app);
    for (let i = 0; i < 3; i++) expect((await agent.get('/auth/github?login=ada-demo')).status).toBe(302);
    const limited = await agent.get('/auth/github?login=ada-demo');
    expect(limited.status).toBe(429);
    expect(limited.text).toMatch(/Too many sign-in attempts/);
    await fetchCsrf(agent);
  });
});
