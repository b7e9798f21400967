import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { asc } from 'drizzle-orm';
import { memberships, projects, revisions } from '../../server/db/schema';
import { signIn, type Client } from '../support/auth';
import { dividerSheet } from './fixtures';
import { startTestApp, type TestApp } from './test-app';

let s: TestApp;
let ada: Client;
let ben: Client;
let projectId: string;
beforeAll(async () => {
  s = await startTestApp();
  ada = await signIn(s.app, 'ada-demo');
  ben = await signIn(s.app, 'ben-demo');
  projectId = (await ada.post('/api/projects').send({ title: 'Guarded', sheet: dividerSheet() })).body.id;
});
afterAll(async () => { await s?.close(); });

const state = async () => JSON.stringify({
  p: await s.t.database.db.select().from(projects).orderBy(asc(projects.id)),
  m: await s.t.database.db.select().from(memberships).orderBy(asc(memberships.userId)),
  r: await s.t.database.db.select().from(revisions),
});

describe('CSRF protection on cookie-authenticated mutations', () => {
  const mutations = (): [string, string, Record<string, unknown>?][] => [
    ['post', '/api/projects', { title: 'x' }],
    ['patch', `/api/projects/${projectId}`, { title: 'x', baseVersion: 1 }],
    ['delete', `/api/projects/${projectId}`],
    ['post', `/api/projects/${projectId}/invitations`, { email: 'x@example.test', role: 'viewer' }],
    ['patch', `/api/projects/${projectId}/members/${ada.user!.id}`, { role: 'viewer' }],
    ['delete', `/api/projects/${projectId}/members/${ada.user!.id}`],
    ['post', `/api/projects/${projectId}/revisions`, { label: 'x' }],
    ['put', `/api/projects/${projectId}/share`, { enabled: true }],
    ['post', '/api/projects/import'],
    ['post', '/api/invitations/abcdefghijklmnopqrstuvwxyz/accept'],
  ];

  it('refuses every POST/PATCH/PUT/DELETE without the token with 403, changing nothing', async () => {
    const before = await state();
    for (const [method, path, body] of mutations()) {
      const req = (ada.agent as unknown as Record<string, (p: string) => request.Test>)[method](path);
      const res = await (body ? req.send(body) : req);
      expect(res.status, `${method} ${path}`).toBe(403);
      expect(res.body.error.code).toBe('csrf_invalid');
    }
    expect(await state()).toBe(before);
  });

  it('refuses a wrong token and another session’s token', async () => {
    const wrong = await ada.agent.post('/api/projects').set('X-CSRF-Token', 'not-the-token').send({ title: 'x' });
    expect(wrong.status).toBe(403);
    const other = await ada.agent.post('/api/projects').set('X-CSRF-Token', ben.csrf).send({ title: 'x' });
    expect(other.status).toBe(403);
    const right = await ada.post('/api/projects').send({ title: 'with token' });
    expect(right.status).toBe(201);
  });

  it('gives each session its own token, stable within the session', async () => {
    const again = (await ada.get('/api/csrf')).body.token;
    expect(again).toBe(ada.csrf);
    expect(ben.csrf).not.toBe(ada.csrf);
  });

  it('does not guard reads', async () => {
    expect((await ada.agent.get(`/api/projects/${projectId}`)).status).toBe(200);
  });
});

describe('security headers', () => {
  it('sends a content security policy the app can run under, and the usual helmet headers', async () => {
    const res = await request(s.app).get('/api/health').set('Host', '127.0.0.1:5173');
    const csp = res.headers['content-security-policy'] as string;
    const directives = Object.fromEntries(csp.split(';').map((d) => d.trim().split(/\s+/)).map(([k, ...v]) => [k, v]));
    expect(directives['default-src']).toEqual(["'self'"]);
    expect(directives['script-src']).toEqual(["'self'"]); // no inline or eval'd scripts
    expect(directives['style-src']).toEqual(["'self'", "'unsafe-inline'"]); // React Flow positions nodes inline
    expect(directives['img-src']).toEqual(expect.arrayContaining(["'self'", 'data:', 'blob:']));
    expect(directives['worker-src']).toContain("'self'");
    expect(directives['connect-src']).toEqual(["'self'", 'ws://127.0.0.1:5173', 'wss://127.0.0.1:5173']);
    expect(directives['object-src']).toEqual(["'none'"]);
    expect(directives['frame-ancestors']).toEqual(["'none'"]);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
    expect(res.headers['referrer-policy']).toBe('same-origin');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('keeps a crafted Host header out of the policy', async () => {
    const res = await request(s.app).get('/api/health').set('Host', "evil; script-src 'unsafe-inline'");
    expect(res.headers['content-security-policy']).not.toContain('unsafe-inline\'; ');
    expect(res.headers['content-security-policy']).not.toMatch(/script-src 'self' 'unsafe-inline'/);
    expect(res.headers['content-security-policy']).not.toContain('evil');
  });
});

describe('request size limits', () => {
  it('answers 413 to a JSON body over 1 MB', async () => {
    const huge = { title: 'big', sheet: { ...dividerSheet(), description: 'x'.repeat(1024 * 1024 + 1) } };
    const res = await ada.post('/api/projects').send(huge);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
  });
});

describe('errors never carry a stack trace', () => {
  it('answers unknown API routes and bad ids with JSON', async () => {
    const res = await ada.get('/api/projects/00000000-0000-4000-8000-000000000000/revisions');
    expect(res.status).toBe(404);
    expect(res.text).not.toMatch(/at .*\.ts:\d+/);
  });
});
