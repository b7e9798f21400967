// One transaction for a group of batches of one project: lock the project row, read what the
// decision needs, write the new snapshot and the log rows, commit. Nothing is acknowledged or
// broadcast before COMMIT returns, so an acknowledged batch survives a crash of this process.
//
// Plain SQL on a pooled client rather than the query builder: this is the hot path. The
// transaction takes two round trips, not four: "begin" travels with the locking read and the
// write with "commit", as multi-statement simple queries (node-postgres does not pipeline, and
// the extended protocol takes one statement per message). Simple queries carry no parameters, so
// every value goes in as a literal: numbers checked to be integers, text through the driver's
// escapeLiteral. Under load each round trip is a chance to wait on a busy machine; halving them
// shortened the tail of the two-process benchmark (bench/realtime.bench.ts).
import type pg from 'pg';
import { normalizeForSync } from '../../shared/sync/normalize';
import type { JsonObject } from '../../shared/sync/ops';
import type { Role } from '../../shared/sync/protocol';
import { decideGroup, type BatchOutcome, type QueuedBatch } from './decide';

/** The project's document as this process last committed or read it. */
export interface CachedDoc {
  version: number;
  doc: JsonObject;
}

export interface GroupResult {
  outcomes: BatchOutcome[];
  /** null when the project is gone or the transaction failed (read it afresh next time) */
  cache: CachedDoc | null;
  /** accepted batches with their versions, for the broadcast */
  accepted: { batch: QueuedBatch; version: number }[];
}

interface LockedRow {
  version: number;
  sheet: JsonObject | null;
  roles: Record<string, Role>;
  sessions: string[];
  logged: Record<string, number>;
}

// set_config(..., true) marks this transaction as the live path for the log trigger
// (drizzle/0003_realtime_notifications.sql). The sheet is only read when our copy is stale.
type Quote = (text: string) => string;

function int(n: number): string {
  if (!Number.isSafeInteger(n)) throw new Error(`not an integer: ${n}`);
  return String(n);
}

function textArray(quote: Quote, values: readonly string[]): string {
  return values.length ? `array[${values.map(quote).join(', ')}]::text[]` : `'{}'::text[]`;
}

function beginAndLock(quote: Quote, projectId: string, cachedVersion: number, authorIds: number[], sessionIds: string[], batchIds: string[]): string {
  const project = `${quote(projectId)}::uuid`;
  return `begin;
  select set_config('tapline.sheet_writer', 'realtime', true) as writer,
         p.version,
         case when p.version = ${int(cachedVersion)} then null else p.sheet end as sheet,
         (select coalesce(json_object_agg(m.user_id, m.role), '{}'::json)
            from memberships m where m.project_id = p.id and m.user_id = any(array[${authorIds.map(int).join(', ')}]::int[])) as roles,
         (select coalesce(json_agg(s.sid), '[]'::json)
            from session s where s.sid = any(${textArray(quote, sessionIds)}) and s.expire > now()) as sessions,
         (select coalesce(json_object_agg(o.batch_id, o.version), '{}'::json)
            from sheet_ops o where o.project_id = p.id and o.batch_id = any(${textArray(quote, batchIds)})) as logged
    from projects p where p.id = ${project}
     for update of p`;
}

function writeAndCommit(quote: Quote, projectId: string, docJson: string, version: number, authorId: number, entriesJson: string): string {
  const project = `${quote(projectId)}::uuid`;
  return `with snapshot as (
    update projects set sheet = ${quote(docJson)}::jsonb, version = ${int(version)}, updated_at = now(), updated_by = ${int(authorId)} where id = ${project}
  )
  insert into sheet_ops (project_id, version, author_id, ops, batch_id)
  select ${project}, (e->>'version')::int, (e->>'authorId')::int, e->'ops', e->>'batchId'
    from jsonb_array_elements(${quote(entriesJson)}::jsonb) as e;
  commit`;
}

const unavailable = (): BatchOutcome => ({ ok: false, error: { code: 'unavailable', message: 'The server could not save your change (database unavailable); it will be sent again.' } });

/** Decide and store a group of batches (arrival order) for one project. Never throws. */
export async function commitGroup(pool: pg.Pool, projectId: string, cache: CachedDoc | null, group: readonly QueuedBatch[]): Promise<GroupResult> {
  let client: pg.PoolClient | undefined;
  let broken = false;
  try {
    client = await pool.connect();
    const c = client;
    const quote: Quote = (text) => c.escapeLiteral(text);
    const results = (await client.query(
      beginAndLock(quote, projectId, cache?.version ?? -1, [...new Set(group.map((b) => b.author.id))], [...new Set(group.map((b) => b.sessionId))], group.map((b) => b.request.batchId)),
    )) as unknown as pg.QueryResult[];
    const row = results[1].rows[0] as LockedRow | undefined;
    if (!row) {
      await client.query('rollback');
      const gone: BatchOutcome = { ok: false, error: { code: 'not_found', message: 'This project was deleted.' } };
      return { outcomes: group.map(() => gone), cache: null, accepted: [] };
    }
    const doc = row.sheet === null && cache ? cache.doc : normalizeForSync(row.sheet ?? {});
    const decision = decideGroup({ version: row.version, doc, roles: row.roles, liveSessions: new Set(row.sessions), logged: row.logged }, group);
    if (!decision.accepted.length) {
      await client.query('rollback');
      return { outcomes: decision.outcomes, cache: { version: row.version, doc }, accepted: [] };
    }
    const last = decision.accepted[decision.accepted.length - 1].batch;
    const entries = decision.accepted.map(({ batch, version }) => ({ version, authorId: batch.author.id, ops: batch.request.ops, batchId: batch.request.batchId }));
    await client.query(writeAndCommit(quote, projectId, JSON.stringify(decision.doc), decision.version, last.author.id, JSON.stringify(entries)));
    return { outcomes: decision.outcomes, cache: { version: decision.version, doc: decision.doc }, accepted: decision.accepted };
  } catch (err) {
    console.error(`realtime: saving operations for project ${projectId} failed: ${(err as Error).message}`);
    await client?.query('rollback').catch(() => {
      broken = true;
    });
    return { outcomes: group.map(unavailable), cache: null, accepted: [] };
  } finally {
    // A connection that could not even roll back is discarded, not returned to the pool.
    client?.release(broken);
  }
}
