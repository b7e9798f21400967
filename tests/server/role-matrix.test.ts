// The role matrix: every route, once per role (signed out, non-member, viewer, editor, owner).
// Each case runs on a fresh project; when the answer is a refusal, the database must be unchanged.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { asc, sql } from 'drizzle-orm';
import { invitations, memberships, projects, revisions, users } from '../../server/db/schema';
import { newInvitationToken } from '../../server/invitations/tokens';
import { signIn, signedOut, type Client } from '../support/auth';
import { dividerSheet, dividerWithR2 } from './fixtures';
import { startTestApp, type TestApp } from './test-app';

type Who = 'signed-out' | 'non-member' | 'viewer' | 'editor' | 'owner';
const WHO: Who[] = ['signed-out', 'non-member', 'viewer', 'editor', 'owner'];

interface Fixture { id: string; revId: string; invId: string; inviteToken: string; shareToken: string; targetUserId: number }
type Method = 'get' | 'post' | 'patch' | 'put' | 'del';
interface RouteCase {
  name: string;
  method: Method;
  path: (f: Fixture, me: Client) => string;
  body?: Record<string, unknown>;
  attach?: boolean;
  /** weakest caller allowed */
  need: 'public' | 'signed-in' | 'viewer' | 'editor' | 'owner';
  ok: number;
  /** answers that differ from what `need` implies */
  except?: Partial<Record<Who, number>>;
}

const routes: RouteCase[] = [
  { name: 'GET /api/me', method: 'get', path: () => '/api/me', need: 'signed-in', ok: 200 },
  { name: 'GET /api/projects', method: 'get', path: () => '/api/projects', need: 'signed-in', ok: 200 },
  { name: 'POST /api/projects', method: 'post', path: () => '/api/projects', body: { title: 'Matrix new' }, need: 'signed-in', ok: 201 },
  { name: 'POST /api/projects/import', method: 'post', path: () => '/api/projects/import', attach: true, need: 'signed-in', ok: 201 },
  { name: 'GET /api/projects/:id', method: 'get', path: (f) => `/api/projects/${f.id}`, need: 'viewer', ok: 200 },
  { name: 'PATCH /api/projects/:id (sheet)', method: 'patch', path: (f) => `/api/projects/${f.id}`, body: { sheet: dividerWithR2(1234), baseVersion: 1 }, need: 'editor', ok: 200 },
  { name: 'PATCH /api/projects/:id (title)', method: 'patch', path: (f) => `/api/projects/${f.id}`, body: { title: 'Renamed', baseVersion: 1 }, need: 'owner', ok: 200 },
  { name: 'DELETE /api/projects/:id', method: 'del', path: (f) => `/api/projects/${f.id}`, need: 'owner', ok: 204 },
  { name: 'GET /api/projects/:id/export', method: 'get', path: (f) => `/api/projects/${f.id}/export`, need: 'viewer', ok: 200 },
  { name: 'GET /api/projects/:id/members', method: 'get', path: (f) => `/api/projects/${f.id}/members`, need: 'viewer', ok: 200 },
  { name: 'PATCH /api/projects/:id/members/:userId', method: 'patch', path: (f) => `/api/projects/${f.id}/members/${f.targetUserId}`, body: { role: 'editor' }, need: 'owner', ok: 200 },
  { name: 'DELETE /api/projects/:id/members/:userId (someone else)', method: 'del', path: (f) => `/api/projects/${f.id}/members/${f.targetUserId}`, need: 'owner', ok: 204 },
  // Leaving: any member may remove themselves, except the last owner.
  { name: 'DELETE /api/projects/:id/members/:userId (self)', method: 'del', path: (f, me) => `/api/projects/${f.id}/members/${me.user?.id ?? 1}`, need: 'viewer', ok: 204, except: { owner: 409 } },
  { name: 'GET /api/projects/:id/invitations', method: 'get', path: (f) => `/api/projects/${f.id}/invitations`, need: 'owner', ok: 200 },
  { name: 'POST /api/projects/:id/invitations', method: 'post', path: (f) => `/api/projects/${f.id}/invitations`, body: { email: 'matrix@example.test', role: 'viewer' }, need: 'owner', ok: 201 },
  { name: 'DELETE /api/projects/:id/invitations/:invId', method: 'del', path: (f) => `/api/projects/${f.id}/invitations/${f.invId}`, need: 'owner', ok: 204 },
  { name: 'GET /api/projects/:id/revisions', method: 'get', path: (f) => `/api/projects/${f.id}/revisions`, need: 'viewer', ok: 200 },
  { name: 'GET /api/projects/:id/revisions/:revId', method: 'get', path: (f) => `/api/projects/${f.id}/revisions/${f.revId}`, need: 'viewer', ok: 200 },
  { name: 'POST /api/projects/:id/revisions', method: 'post', path: (f) => `/api/projects/${f.id}/revisions`, body: { label: 'Matrix' }, need: 'editor', ok: 201 },
  { name: 'POST /api/projects/:id/revisions/:revId/restore', method: 'post', path: (f) => `/api/projects/${f.id}/revisions/${f.revId}/restore`, need: 'editor', ok: 200 },
  { name: 'PUT /api/projects/:id/share', method: 'put', path: (f) => `/api/projects/${f.id}/share`, body: { enabled: false }, need: 'owner', ok: 200 },
  { name: 'GET /api/shared/:token', method: 'get', path: (f) => `/api/shared/${f.shareToken}`, need: 'public', ok: 200 },
  { name: 'GET /api/invitations/:token', method: 'get', path: (f) => `/api/invitations/${f.inviteToken}`, need: 'public', ok: 200 },
  { name: 'POST /api/invitations/:token/accept', method: 'post', path: (f) => `/api/invitations/${f.inviteToken}/accept`, need: 'signed-in', ok: 200 },
  { name: 'GET /api/health', method: 'get', path: () => '/api/health', need: 'public', ok: 200 },
];

const RANK: Record<Who, number> = { 'signed-out': 0, 'non-member': 1, viewer: 2, editor: 3, owner: 4 };

function expected(route: RouteCase, who: Who): number {
  if (route.except?.[who] !== undefined) return route.except[who]!;
  if (route.need === 'public') return route.ok;
  if (who === 'signed-out') return 401;
  if (route.need === 'signed-in') return route.ok;
  if (who === 'non-member') return 404;
  return RANK[who] >= RANK[route.need] ? route.ok : 403;
}

let s: TestApp;
const clients = {} as Record<Who, Client>;
let eveId: number;

beforeAll(async () => {
  s = await startTestApp();
  clients.owner = await signIn(s.app, 'ada-demo');
  clients.editor = await signIn(s.app, 'ben-demo');
  clients.viewer = await signIn(s.app, 'chen-demo');
  clients['non-member'] = await signIn(s.app, 'dana-outsider');
  clients['signed-out'] = await signedOut(s.app);
  const [eve] = await s.t.database.db.insert(users).values({ providerId: 'matrix-eve', login: 'eve-matrix', name: 'Eve (test)' }).returning();
  eveId = eve.id;
});
afterAll(async () => { await s?.close(); });

/** A project owned by ada, with ben editor, chen and eve viewers, one revision, one pending invitation, sharing on. */
async function fixture(): Promise<Fixture> {
  const db = s.t.database.db;
  const [p] = await db.insert(projects).values({ title: 'Matrix project', sheet: dividerSheet(), createdBy: clients.owner.user!.id, shareToken: `share-${crypto.randomUUID()}` }).returning();
  await db.insert(memberships).values([
    { projectId: p.id, userId: clients.owner.user!.id, role: 'owner' },
    { projectId: p.id, userId: clients.editor.user!.id, role: 'editor' },
    { projectId: p.id, userId: clients.viewer.user!.id, role: 'viewer' },
    { projectId: p.id, userId: eveId, role: 'viewer' },
  ]);
  const [rev] = await db.insert(revisions).values({ projectId: p.id, label: 'Start', sheet: dividerWithR2(999), projectVersion: 1 }).returning();
  const { token, hash } = newInvitationToken();
  const [inv] = await db.insert(invitations).values({ projectId: p.id, email: 'pending@example.test', role: 'viewer', tokenHash: hash, expiresAt: new Date(Date.now() + 86400_000) }).returning();
  return { id: p.id, revId: rev.id, invId: inv.id, inviteToken: token, shareToken: p.shareToken!, targetUserId: eveId };
}

/** Everything a refused request could have changed. */
async function snapshot() {
  const db = s.t.database.db;
  return JSON.stringify({
    projects: await db.select().from(projects).orderBy(asc(projects.id)),
    memberships: await db.select().from(memberships).orderBy(asc(memberships.projectId), asc(memberships.userId)),
    invitations: await db.select().from(invitations).orderBy(asc(invitations.id)),
    revisions: await db.select().from(revisions).orderBy(asc(revisions.id)),
    mail: (await db.execute(sql`select count(*)::int as n from dev_mail`)).rows,
  });
}

function send(route: RouteCase, who: Who, f: Fixture) {
  const c = clients[who];
  const req = c[route.method](route.path(f, c));
  if (route.attach) return req.attach('file', Buffer.from(JSON.stringify(dividerSheet('Imported in matrix'))), 'm.tapline.json');
  return route.body ? req.send(route.body) : req;
}

describe.each(routes)('$name', (route) => {
  it.each(WHO)('as %s', async (who) => {
    const f = await fixture();
    const before = await snapshot();
    const res = await send(route, who, f);
    const want = expected(route, who);
    expect(res.status, `${route.name} as ${who}: ${res.text.slice(0, 200)}`).toBe(want);
    if (want >= 400) {
      expect(res.body.error?.code, 'a JSON error with a code').toEqual(expect.any(String));
      expect(await snapshot(), 'a refusal changes nothing').toBe(before);
    } else if (route.method !== 'get') {
      expect(await snapshot(), 'an allowed change is stored').not.toBe(before);
    }
  });
});
