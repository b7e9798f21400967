import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { memberships, projects } from '../../server/db/schema';
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

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

describe('projects', () => {
  it('creates a project with a random UUID, the caller as owner, and an empty sheet by default', async () => {
    const res = await ada.post('/api/projects').send({ title: 'Blank bench' });
    expect(res.status).toBe(201);
    expect(res.body.id).toMatch(UUID);
    expect(res.headers.location).toBe(`/api/projects/${res.body.id}`);
    expect(res.body).toMatchObject({ title: 'Blank bench', role: 'owner', version: 1 });
    expect(res.body.sheet).toMatchObject({ format: 'tapline.sheet', version: 1, parts: [], wires: [] });
    const [m] = await s.t.database.db.select().from(memberships).where(eq(memberships.projectId, res.body.id));
    expect(m).toMatchObject({ userId: ada.user!.id, role: 'owner' });
  });

  it('stores a given sheet as sent and reads it back', async () => {
    const created = await ada.post('/api/projects').send({ title: 'Sensor tap', sheet: dividerSheet() });
    const got = await ada.get(`/api/projects/${created.body.id}`);
    expect(got.status).toBe(200);
    expect(got.body).toMatchObject({ id: created.body.id, title: 'Sensor tap', role: 'owner', version: 1 });
    expect(got.body.sheet).toEqual(dividerSheet());
    expect(got.body.share).toEqual({ enabled: false, token: null });
  });

  it('refuses a bad sheet with the part and field named, and stores nothing', async () => {
    const before = (await s.t.database.db.select().from(projects)).length;
    const bad = dividerSheet();
    (bad.parts[1].params as Record<string, unknown>).resistance = '10k';
    const res = await ada.post('/api/projects').send({ title: 'Bad', sheet: bad });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_sheet');
    expect(res.body.error.field).toBe('sheet.parts[1].params.resistance');
    expect(res.body.error.message).toMatch(/R1/);
    expect(res.body.error.issues[0]).toMatchObject({ partId: 'R1', field: 'resistance' });
    expect((await s.t.database.db.select().from(projects)).length).toBe(before);
  });

  it('validates titles and unknown fields with zod', async () => {
    const empty = await ada.post('/api/projects').send({ title: '   ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error).toMatchObject({ code: 'invalid_request', field: 'title' });
    const long = await ada.post('/api/projects').send({ title: 'x'.repeat(121) });
    expect(long.body.error.field).toBe('title');
    const newline = await ada.post('/api/projects').send({ title: 'two\nlines' });
    expect(newline.status).toBe(400);
    const extra = await ada.post('/api/projects').send({ title: 'ok', owner: 5 });
    expect(extra.status).toBe(400);
    const notJson = await ada.post('/api/projects').set('Content-Type', 'application/json').send('{"title":');
    expect(notJson.status).toBe(400);
    expect(notJson.body.error.code).toBe('malformed_json');
  });

  it('saves a sheet change with baseVersion, bumping the version, and answers 409 to a stale one', async () => {
    const { body: p } = await ada.post('/api/projects').send({ title: 'Versioned', sheet: dividerSheet() });
    const first = await ada.patch(`/api/projects/${p.id}`).send({ sheet: dividerWithR2(2200), baseVersion: 1 });
    expect(first.status).toBe(200);
    expect(first.body.version).toBe(2);
    expect(first.body.sheet.parts[2].params.resistance).toBe(2200);
    expect(first.body.updatedBy).toMatchObject({ login: 'ada-demo' });

    const stale = await ada.patch(`/api/projects/${p.id}`).send({ sheet: dividerWithR2(3300), baseVersion: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatchObject({ code: 'version_conflict', currentVersion: 2, field: 'baseVersion' });
    const [row] = await s.t.database.db.select().from(projects).where(eq(projects.id, p.id));
    expect(row.version).toBe(2);
    expect((row.sheet as ReturnType<typeof dividerSheet>).parts[2].params).toEqual({ resistance: 2200 });

    const missing = await ada.patch(`/api/projects/${p.id}`).send({ sheet: dividerWithR2(3300) });
    expect(missing.status).toBe(400);
    expect(missing.body.error.field).toBe('baseVersion');
  });

  it('accepts exactly one of several simultaneous saves based on the same version', async () => {
    const { body: p } = await ada.post('/api/projects').send({ title: 'Race', sheet: dividerSheet() });
    const answers = await Promise.all([1000, 2000, 3000, 4000, 5000].map((r) => ada.patch(`/api/projects/${p.id}`).send({ sheet: dividerWithR2(r), baseVersion: 1 })));
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses).toEqual([200, 409, 409, 409, 409]);
    const winner = answers.find((a) => a.status === 200)!;
    const [row] = await s.t.database.db.select().from(projects).where(eq(projects.id, p.id));
    expect(row.version).toBe(2);
    expect(row.sheet).toEqual(winner.body.sheet);
  });

  it('renames without bumping the sheet version', async () => {
    const { body: p } = await ada.post('/api/projects').send({ title: 'Old name' });
    const res = await ada.patch(`/api/projects/${p.id}`).send({ title: 'New name', baseVersion: 1 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ title: 'New name', version: 1 });
  });

  it('lists only the caller’s projects, newest change first, with role and last change', async () => {
    const { body: mine } = await ben.post('/api/projects').send({ title: 'Ben private' });
    const list = await ben.get('/api/projects');
    expect(list.status).toBe(200);
    expect(list.body.projects.map((p: { id: string }) => p.id)).toEqual([mine.id]);
    expect(list.body.projects[0]).toMatchObject({ title: 'Ben private', role: 'owner', version: 1, memberCount: 1, partCount: 0, updatedBy: { login: 'ben-demo' } });
    const adas = await ada.get('/api/projects');
    expect(adas.body.projects.some((p: { id: string }) => p.id === mine.id)).toBe(false);
    const times = adas.body.projects.map((p: { updatedAt: string }) => Date.parse(p.updatedAt));
    expect([...times].sort((a, b) => b - a)).toEqual(times);
  });

  it('deletes a project and everything in it', async () => {
    const { body: p } = await ada.post('/api/projects').send({ title: 'Doomed' });
    expect((await ada.del(`/api/projects/${p.id}`)).status).toBe(204);
    expect((await ada.get(`/api/projects/${p.id}`)).status).toBe(404);
    expect(await s.t.database.db.select().from(memberships).where(eq(memberships.projectId, p.id))).toHaveLength(0);
  });

  it('answers 404 for a malformed or unknown project id without touching the database type', async () => {
    expect((await ada.get('/api/projects/not-a-uuid')).status).toBe(404);
    expect((await ada.get('/api/projects/00000000-0000-4000-8000-000000000000')).body.error.code).toBe('project_not_found');
  });
});
