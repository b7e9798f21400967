// Hostile uploads to POST /api/projects/import: files over the limit, several files, files in the
// wrong field, extra or oversized form fields, broken multipart framing, files that are not JSON,
// not UTF-8 or not sheets, sheets the database could not store verbatim, and file names that try
// path traversal, markup or header tricks. Each refusal is a clear 4xx that changes nothing; an
// accepted file name becomes the title as text only.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type request from 'supertest';
import { projects } from '../../server/db/schema';
import { MAX_SHEET_FILE_BYTES } from '../../server/projects/import-export';
import { signIn, type Client } from '../support/auth';
import { dividerSheet } from './fixtures';
import { expectRefusal, snapshotTables } from './hostile-support';
import { startTestApp, type TestApp } from './test-app';

let s: TestApp;
let ada: Client;
beforeAll(async () => {
  s = await startTestApp();
  ada = await signIn(s.app, 'ada-demo');
});
afterAll(async () => { await s?.close(); });

const json = (v: unknown) => Buffer.from(JSON.stringify(v));
const untitled = () => {
  const { title: _t, ...rest } = dividerSheet();
  return rest;
};
const upload = () => ada.post('/api/projects/import');

async function refused(what: string, status: number, code: string | undefined, send: () => request.Test | Promise<request.Response>) {
  const before = await snapshotTables(s.t.database);
  const res = await send();
  expectRefusal(res, status, what, code);
  expect(await snapshotTables(s.t.database), `${what}: database unchanged`).toBe(before);
  return res;
}

describe('multipart framing and limits', () => {
  it('a file one byte over the limit: 413 file_too_large', async () => {
    await refused('oversized', 413, 'file_too_large', () => upload().attach('file', Buffer.alloc(MAX_SHEET_FILE_BYTES + 1, 32), 'big.tapline.json'));
  });

  it('two files: 400 bad_upload', async () => {
    await refused('two files', 400, 'bad_upload', () => upload().attach('file', json(dividerSheet()), 'a.json').attach('file', json(dividerSheet()), 'b.json'));
  });

  it('a file in another field: 400 naming that field', async () => {
    const res = await refused('wrong field', 400, 'bad_upload', () => upload().attach('upload', json(dividerSheet()), 'a.json'));
    expect(res.body.error.field).toBe('upload');
  });

  it('an unknown form field: 400 naming it', async () => {
    const res = await refused('unknown field', 400, 'invalid_request', () => upload().field('owner', 'eve').attach('file', json(dividerSheet()), 'a.json'));
    expect(res.body.error.field).toBe('owner');
  });

  it('too many fields, or a field value over 1 kB: 400 bad_upload', async () => {
    await refused('many fields', 400, 'bad_upload', () => {
      let r = upload();
      for (let i = 0; i < 6; i++) r = r.field(`f${i}`, 'x');
      return r.attach('file', json(dividerSheet()), 'a.json');
    });
    await refused('long title', 400, 'bad_upload', () => upload().field('title', 'x'.repeat(2000)).attach('file', json(dividerSheet()), 'a.json'));
  });

  it('no boundary, a truncated body, or garbage framing: 400', async () => {
    await refused('no boundary', 400, 'bad_upload', () => upload().set('Content-Type', 'multipart/form-data').send('--x\r\n\r\n'));
    const truncated = '--b\r\nContent-Disposition: form-data; name="file"; filename="a.json"\r\nContent-Type: application/json\r\n\r\n{"format":';
    await refused('truncated', 400, 'bad_upload', () => upload().set('Content-Type', 'multipart/form-data; boundary=b').send(truncated));
    await refused('garbage', 400, undefined, () => upload().set('Content-Type', 'multipart/form-data; boundary=b').send(randomBytes(4096).toString('latin1')));
  });

  it('no file at all: 400 file_missing', async () => {
    await refused('no file', 400, 'file_missing', () => upload().field('title', 'Only a title'));
  });
});

describe('file contents', () => {
  it.each([
    ['random bytes', randomBytes(2048), 'invalid_file'],
    ['UTF-16 JSON', Buffer.from(`\uFEFF${JSON.stringify(dividerSheet())}`, 'utf16le'), 'invalid_file'],
    ['a ZIP header', Buffer.from('PK\u0003\u0004 not really a zip', 'latin1'), 'invalid_file'],
    ['an empty file', Buffer.alloc(0), 'invalid_file'],
    ['a JSON list', json([dividerSheet()]), 'invalid_sheet'],
    ['a JSON string', json('DROP TABLE projects'), 'invalid_sheet'],
    ['an object that is not a sheet', json({ hello: 'world' }), 'invalid_sheet'],
    ['a sheet with a NUL in a label', json({ ...dividerSheet(), parts: dividerSheet().parts.map((p, i) => (i === 1 ? { ...p, label: 'a\u0000b' } : p)) }), 'invalid_sheet'],
    ['a sheet with a lone surrogate', Buffer.from(JSON.stringify(dividerSheet()).replace('"Divider (test)"', '"Divider \\ud800"')), 'invalid_sheet'],
    ['a sheet with 1e999', Buffer.from(JSON.stringify(dividerSheet()).replace(/^\{/, '{"extra":1e999,')), 'invalid_sheet'],
    ['a sheet nested 100 000 deep', Buffer.from(JSON.stringify(dividerSheet()).replace(/^\{/, `{"extra":${'['.repeat(100_000)}${']'.repeat(100_000)},`)), 'invalid_sheet'],
  ])('%s: 400 %s', async (what, buf, code) => {
    await refused(what, 400, code, () => upload().attach('file', buf, 'upload.tapline.json'));
  });

  it('a sheet file with a UTF-8 byte-order mark is accepted', async () => {
    const res = await upload().attach('file', Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), json(dividerSheet('With BOM'))]), 'bom.tapline.json');
    expect(res.status, res.text).toBe(201);
    expect(res.body.title).toBe('With BOM');
  });
});

describe('file names', () => {
  it.each([
    ['<img src=x onerror=alert(1)>.tapline.json', '<img src=x onerror=alert(1)>'],
    // Folders in a file name are dropped (busboy keeps the base name): nothing reaches a path.
    ['../../../etc/passwd', 'passwd'],
    ['<script>alert(1)</script>.json', 'script>'],
    ["Robert'); DROP TABLE projects;--.json", "Robert'); DROP TABLE projects;--"],
    ['Divider — v2 Ω.tapline.json', 'Divider — v2 Ω'],
  ])('%j becomes the title %j as plain text', async (name, title) => {
    const res = await upload().attach('file', json(untitled()), name);
    expect(res.status, res.text).toBe(201);
    const [row] = await s.t.database.db.select().from(projects).where(eq(projects.id, res.body.id));
    expect(row.title).toBe(title);
    const exported = await ada.get(`/api/projects/${res.body.id}/export`);
    expect(exported.headers['content-disposition']).toMatch(/^attachment; filename="[a-z0-9-]+\.tapline\.json"$/);
  });

  it('a very long file name is cut to a 120-character title, and to a short mention in errors', async () => {
    const name = `${'n'.repeat(5000)}.json`;
    const ok = await upload().attach('file', json(untitled()), name);
    expect(ok.status, ok.text.slice(0, 200)).toBe(201);
    expect(ok.body.title).toHaveLength(120);
    const bad = await refused('long name, bad file', 400, 'invalid_file', () => upload().attach('file', Buffer.from('not json'), name));
    expect(bad.body.error.message.length).toBeLessThan(400);
  });
});
