// Hostile request bodies on every JSON route that changes something: malformed JSON, bodies over
// the 1 MB limit, wrong media types, charsets and encodings, non-object bodies, unknown and
// prototype-polluting fields, wrong value types. Each must get a clear 4xx in the API's error
// shape and leave the database as it was (a snapshot of the tables before and after). A valid
// body on the same route is the control: it must succeed, so the refusals are not an accident.
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { memberships, projects, revisions } from '../../server/db/schema';
import { signIn, type Client } from '../support/auth';
import { dividerSheet, dividerWithR2 } from './fixtures';
import { expectRefusal, snapshotTables } from './hostile-support';
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

interface Fixture { id: string; revId: string; benId: number }

/** A project of ada's with ben as a viewer and one saved revision. */
async function fixture(): Promise<Fixture> {
  const db = s.t.database.db;
  const [p] = await db.insert(projects).values({ title: 'Hostile body target', sheet: dividerSheet(), createdBy: ada.user!.id }).returning();
  await db.insert(memberships).values([
    { projectId: p.id, userId: ada.user!.id, role: 'owner' },
    { projectId: p.id, userId: ben.user!.id, role: 'viewer' },
  ]);
  const [rev] = await db.insert(revisions).values({ projectId: p.id, label: 'Start', sheet: dividerWithR2(999), projectVersion: 1 }).returning();
  return { id: p.id, revId: rev.id, benId: ben.user!.id };
}

type Method = 'post' | 'patch' | 'put';
interface JsonRoute {
  name: string;
  method: Method;
  path: (f: Fixture) => string;
  valid: Record<string, unknown>;
  ok: number;
  /** a field of `valid` and a value of the wrong type for it */
  wrongType: [string, unknown][];
}

const routes: JsonRoute[] = [
  { name: 'POST /api/projects', method: 'post', path: () => '/api/projects', valid: { title: 'Fresh', sheet: dividerSheet() }, ok: 201,
    wrongType: [['title', 42], ['title', ['a']], ['title', null], ['title', { $ne: null }]] },
  { name: 'PATCH /api/projects/:id', method: 'patch', path: (f) => `/api/projects/${f.id}`, valid: { sheet: dividerWithR2(5600), baseVersion: 1 }, ok: 200,
    wrongType: [['baseVersion', '1'], ['baseVersion', 1.5], ['baseVersion', -1], ['baseVersion', 2 ** 40], ['baseVersion', null], ['sheet', 'a sheet'], ['sheet', null], ['sheet', []]] },
  { name: 'POST /api/projects/:id/invitations', method: 'post', path: (f) => `/api/projects/${f.id}/invitations`, valid: { email: 'new.person@example.test', role: 'editor' }, ok: 201,
    wrongType: [['email', 7], ['email', ['a@example.test']], ['role', 1], ['role', ['editor']], ['role', null]] },
  { name: 'PATCH /api/projects/:id/members/:userId', method: 'patch', path: (f) => `/api/projects/${f.id}/members/${f.benId}`, valid: { role: 'editor' }, ok: 200,
    wrongType: [['role', true], ['role', { toString: 'owner' }], ['role', ['owner']]] },
  { name: 'POST /api/projects/:id/revisions', method: 'post', path: (f) => `/api/projects/${f.id}/revisions`, valid: { label: 'Checked' }, ok: 201,
    wrongType: [['label', 3], ['label', { text: 'x' }], ['label', null]] },
  { name: 'POST /api/projects/:id/revisions/:revId/restore', method: 'post', path: (f) => `/api/projects/${f.id}/revisions/${f.revId}/restore`, valid: { baseVersion: 1 }, ok: 200,
    wrongType: [['baseVersion', '1'], ['baseVersion', 1e308], ['baseVersion', true]] },
  { name: 'PUT /api/projects/:id/share', method: 'put', path: (f) => `/api/projects/${f.id}/share`, valid: { enabled: true }, ok: 200,
    wrongType: [['enabled', 'true'], ['enabled', 1], ['enabled', null]] },
];

const send = (route: JsonRoute, f: Fixture): request.Test => ada[route.method](route.path(f));

/** Runs `act` on a fresh fixture and checks the refusal and that nothing changed. */
async function refused(route: JsonRoute, what: string, status: number, code: string | undefined, act: (req: request.Test) => request.Test | Promise<request.Response>) {
  const f = await fixture();
  const before = await snapshotTables(s.t.database);
  const res = await act(send(route, f));
  expectRefusal(res, status, `${route.name}, ${what}`, code);
  expect(await snapshotTables(s.t.database), `${route.name}, ${what}: the database is unchanged`).toBe(before);
  return res;
}

describe.each(routes)('$name', (route) => {
  it('accepts the valid body (the control)', async () => {
    const f = await fixture();
    const before = await snapshotTables(s.t.database);
    const res = await send(route, f).send(route.valid);
    expect(res.status, res.text.slice(0, 300)).toBe(route.ok);
    expect(await snapshotTables(s.t.database)).not.toBe(before);
  });

  it.each([
    ['cut off', '{"a": '],
    ['single quotes', "{'title': 'x'}"],
    ['trailing garbage', '{"title": "x"} DROP TABLE projects'],
    ['a bare string', '"DROP TABLE projects"'],
    ['a number', '42'],
    ['null', 'null'],
    ['binary bytes', '\u0000\u0001\u00ff{'],
  ])('malformed JSON (%s): 400 malformed_json', async (what, text) => {
    await refused(route, what, 400, 'malformed_json', (r) => r.set('Content-Type', 'application/json').send(text));
  });

  it('a body that is an array: 400 invalid_request', async () => {
    await refused(route, 'array body', 400, 'invalid_request', (r) => r.send([route.valid]));
  });

  it('a body over the 1 MB limit: 413 too_large', async () => {
    const big = { ...route.valid, padding: 'x'.repeat(1_100_000) };
    await refused(route, 'oversized', 413, 'too_large', (r) => r.send(big));
  });

  it('a gzip body that inflates past the limit: 413 too_large', async () => {
    const bomb = gzipSync(JSON.stringify({ ...route.valid, padding: ' '.repeat(20_000_000) }));
    expect(bomb.length, 'the compressed body is small').toBeLessThan(100_000);
    // serialize(): superagent would otherwise JSON-encode the Buffer itself.
    await refused(route, 'gzip bomb', 413, 'too_large', (r) => r.set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').serialize((b: unknown) => b as string).send(bomb));
  });

  it.each([
    ['text/plain', JSON.stringify({})],
    ['application/x-www-form-urlencoded', 'title=x&role=owner'],
    ['application/xml', '<project><title>x</title></project>'],
    ['multipart/form-data; boundary=b', '--b\r\nContent-Disposition: form-data; name="title"\r\n\r\nx\r\n--b--\r\n'],
    ['application/json-patch+json', '[]'],
  ])('Content-Type %s: 415 unsupported_media_type', async (type, text) => {
    const body = type === 'text/plain' ? JSON.stringify(route.valid) : text;
    await refused(route, type, 415, 'unsupported_media_type', (r) => r.set('Content-Type', type).send(body));
  });

  it('no Content-Type with a JSON body: 415', async () => {
    await refused(route, 'no content type', 415, 'unsupported_media_type', (r) => r.unset('Content-Type').send(Buffer.from(JSON.stringify(route.valid))));
  });

  it('an unknown charset: 415 unsupported_charset', async () => {
    await refused(route, 'charset', 415, 'unsupported_charset', (r) => r.set('Content-Type', 'application/json; charset=x-tapline-none').send(JSON.stringify(route.valid)));
  });

  it('an unknown or broken content encoding: 415 / 400', async () => {
    await refused(route, 'zstd', 415, 'unsupported_encoding', (r) => r.set('Content-Type', 'application/json').set('Content-Encoding', 'zstd').send(JSON.stringify(route.valid)));
    await refused(route, 'bad gzip', 400, undefined, (r) => r.set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').send('not gzip at all'));
  });

  it.each([
    ['an unknown field', { isAdmin: true }, 'isAdmin'],
    ['a role smuggled in', { owner: true, role_override: 'owner' }, 'owner'],
    ['createdBy', { createdBy: 1 }, 'createdBy'],
  ])('%s is refused and named: 400', async (what, extra, field) => {
    const res = await refused(route, what, 400, 'invalid_request', (r) => r.send({ ...route.valid, ...extra }));
    expect(res.body.error.field).toBe(field);
  });

  it('a value nested 100 000 levels deep, in a known or an unknown field: 400', async () => {
    const deep = `${'['.repeat(100_000)}${']'.repeat(100_000)}`;
    const [field, ...others] = Object.keys(route.valid);
    const rest = JSON.stringify(Object.fromEntries(others.map((k) => [k, route.valid[k]]))).slice(1, -1);
    const withDeep = (key: string, extra: string) => `{"${key}":${deep}${extra ? `,${extra}` : ''}}`;
    await refused(route, 'deep unknown field', 400, undefined, (r) => r.set('Content-Type', 'application/json').send(withDeep('deep', JSON.stringify(route.valid).slice(1, -1))));
    await refused(route, `deep ${field}`, 400, undefined, (r) => r.set('Content-Type', 'application/json').send(withDeep(field, rest)));
  });

  it.each(['__proto__', 'constructor', 'prototype'])('a "%s" key is refused: 400', async (key) => {
    const text = JSON.stringify(route.valid).replace(/^\{/, `{"${key}": {"admin": true, "role": "owner"},`);
    const res = await refused(route, key, 400, 'invalid_request', (r) => r.set('Content-Type', 'application/json').send(text));
    expect(res.body.error.field).toBe(key);
    expect(({} as Record<string, unknown>).admin, 'Object.prototype is untouched').toBeUndefined();
  });

  it('a wrong type in each field: 400 naming the field', async () => {
    for (const [field, value] of route.wrongType) {
      const res = await refused(route, `${field}=${JSON.stringify(value)}`, 400, undefined, (r) => r.send({ ...route.valid, [field]: value }));
      expect(res.body.error.field ?? '', `${field}=${JSON.stringify(value)}`).toMatch(new RegExp(`^${field}\\b`));
    }
  });
});

describe('routes that take no body', () => {
  it('an empty POST to accept/restore is not a media-type error', async () => {
    const f = await fixture();
    const res = await ada.post(`/api/projects/${f.id}/revisions/${f.revId}/restore`);
    expect(res.status, res.text).toBe(200);
  });

  it('a DELETE with a text body is refused before it does anything', async () => {
    const f = await fixture();
    const before = await snapshotTables(s.t.database);
    const res = await ada.del(`/api/projects/${f.id}`).set('Content-Type', 'text/plain').send('please');
    expectRefusal(res, 415, 'DELETE with text body', 'unsupported_media_type');
    expect(await snapshotTables(s.t.database)).toBe(before);
  });
});
