// What a joining client is sent: the sheet at the current version, and for a rejoin the batches
// it missed and which of its unacknowledged batches were committed. One read-only snapshot, so the
// three agree with each other.
import type pg from 'pg';
import { normalizeForSync } from '../../shared/sync/normalize';
import type { JsonObject, SheetOp } from '../../shared/sync/ops';
import type { LoggedBatch, Role } from '../../shared/sync/protocol';
import type { CachedDoc } from './commit';

/** A rejoin further behind than this gets the sheet only (the log would be longer than the sheet). */
export const MAX_MISSED = 500;

export interface JoinRead {
  role: Role;
  version: number;
  sheet: JsonObject;
  missed?: LoggedBatch[];
  committed?: { batchId: string; version: number }[];
}

interface LogRow {
  version: number;
  ops: SheetOp[];
  batch_id: string | null;
  author_id: number | null;
  login: string | null;
  name: string | null;
  avatar_url: string | null;
}

function toLogged(r: LogRow): LoggedBatch {
  return {
    version: r.version,
    ops: r.ops,
    batchId: r.batch_id,
    author: r.author_id !== null && r.login !== null ? { id: r.author_id, login: r.login, name: r.name, avatarUrl: r.avatar_url } : null,
  };
}

/** The user's role on the project, or null for a non-member (or no such project). */
export async function readRole(pool: pg.Pool, projectId: string, userId: number): Promise<Role | null> {
  const { rows } = await pool.query<{ role: Role }>('select role from memberships where project_id = $1 and user_id = $2', [projectId, userId]);
  return rows[0]?.role ?? null;
}

/** Null when the project does not exist or the user is not a member (the two look the same). */
export async function readForJoin(
  pool: pg.Pool,
  input: { projectId: string; userId: number; sinceVersion?: number; pendingBatchIds?: string[]; cached: CachedDoc | null },
): Promise<JoinRead | null> {
  const client = await pool.connect();
  try {
    await client.query('begin isolation level repeatable read read only');
    const { rows } = await client.query<{ role: Role; version: number; sheet: JsonObject | null }>(
      `select m.role, p.version, case when p.version = $3 then null else p.sheet end as sheet
         from projects p join memberships m on m.project_id = p.id and m.user_id = $2
        where p.id = $1`,
      [input.projectId, input.userId, input.cached?.version ?? -1],
    );
    const row = rows[0];
    if (!row) return null;
    const sheet = row.sheet === null && input.cached ? input.cached.doc : normalizeForSync(row.sheet ?? {});
    const out: JoinRead = { role: row.role, version: row.version, sheet };
    const since = input.sinceVersion;
    if (since !== undefined && since <= row.version && row.version - since <= MAX_MISSED) {
      const log = await client.query<LogRow>(
        `select o.version, o.ops, o.batch_id, o.author_id, u.login, u.name, u.avatar_url
           from sheet_ops o left join users u on u.id = o.author_id
          where o.project_id = $1 and o.version > $2 and o.version <= $3 order by o.version`,
        [input.projectId, since, row.version],
      );
      out.missed = log.rows.map(toLogged);
    }
    if (input.pendingBatchIds?.length) {
      const done = await client.query<{ batch_id: string; version: number }>(
        'select batch_id, version from sheet_ops where project_id = $1 and batch_id = any($2::text[]) and version <= $3',
        [input.projectId, input.pendingBatchIds, row.version],
      );
      out.committed = done.rows.map((r) => ({ batchId: r.batch_id, version: r.version }));
    }
    return out;
  } finally {
    await client.query('rollback').catch(() => undefined);
    client.release();
  }
}

/** One log row as broadcast (a change recorded by the database trigger: REST save, restore). */
export async function readLogged(pool: pg.Pool, projectId: string, version: number): Promise<LoggedBatch | null> {
  const { rows } = await pool.query<LogRow>(
    `select o.version, o.ops, o.batch_id, o.author_id, u.login, u.name, u.avatar_url
       from sheet_ops o left join users u on u.id = o.author_id where o.project_id = $1 and o.version = $2`,
    [projectId, version],
  );
  return rows[0] ? toLogged(rows[0]) : null;
}
