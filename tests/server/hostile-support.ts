// Shared by the hostile-input tests: a snapshot of every table a request could change, and the
// checks every refusal must pass (a JSON error object with code and message, no stack trace).
import { expect } from 'vitest';
import { sql } from 'drizzle-orm';
import type { Database } from '../../server/db/client';

// Sessions are left out: a rolling session's expiry moves on every request, refused or not.
const TABLES = ['users', 'projects', 'memberships', 'invitations', 'revisions', 'sheet_ops', 'dev_mail'] as const;

/** Every row of the tables a request could change, in a stable order, as one string. */
export async function snapshotTables(database: Database): Promise<string> {
  const parts: Record<string, unknown> = {};
  for (const t of TABLES) {
    const { rows } = await database.pool.query(`select to_jsonb(t) as row from ${t} t order by to_jsonb(t)::text`);
    parts[t] = rows.map((r) => r.row);
  }
  return JSON.stringify(parts);
}

/** Row counts, for a failure message that says what changed. */
export async function countRows(database: Database): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const t of TABLES) out[t] = (await database.db.execute(sql.raw(`select count(*)::int as n from ${t}`))).rows[0].n as number;
  return out;
}

interface ErrorResponse {
  status: number;
  text: string;
  headers: Record<string, string>;
  body: { error?: { code?: unknown; message?: unknown; field?: unknown } };
}

/** A refusal in the API's shape: 4xx, JSON `{ error: { code, message, field? } }`, no stack trace. */
export function expectRefusal(res: ErrorResponse, status: number, what: string, code?: string): void {
  expect(res.status, `${what}: ${res.text.slice(0, 300)}`).toBe(status);
  expect(res.headers['content-type'], `${what}: JSON answer`).toMatch(/^application\/json/);
  expect(res.body.error?.code, `${what}: error.code`).toEqual(code ?? expect.any(String));
  expect(res.body.error?.message, `${what}: error.message`).toEqual(expect.any(String));
  if (res.body.error?.field !== undefined) expect(res.body.error.field, `${what}: error.field`).toEqual(expect.any(String));
  // A stack trace would show as "at file:line" frames or source paths.
  expect(res.text, `${what}: no stack trace`).not.toMatch(/\bat [^\s]+ \(|node_modules|\/work\/|\.ts:\d+/);
}
