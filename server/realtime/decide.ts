// The server's decision on a group of batches for one project, given what the locked project row
// and the database said: pure, so the rules are in one place and testable without a socket.
import { parseSheet } from '../../shared/sheet/parse';
import { applyOps } from '../../shared/sync/apply';
import type { JsonObject } from '../../shared/sync/ops';
import { MAX_REBASE_SPAN, type OpRequest, type Refusal, type Role, type UserSummary } from '../../shared/sync/protocol';
import { hasRole } from '../authz/roles';

export interface QueuedBatch {
  request: OpRequest;
  author: UserSummary;
  /** the session the author's socket was opened with */
  sessionId: string;
  /** the author's socket (left out of the broadcast) */
  socketId: string;
}

export type BatchOutcome = { ok: true; version: number; duplicate?: boolean } | { ok: false; error: Refusal };

/** What the database said, read under the project's row lock. */
export interface LockedState {
  version: number;
  doc: JsonObject;
  /** userId → role, for the authors in the group */
  roles: Record<string, Role>;
  /** sessions of the group that still exist */
  liveSessions: ReadonlySet<string>;
  /** batchId → version, for batches of the group already in the log */
  logged: Record<string, number>;
}

export interface Decision {
  outcomes: BatchOutcome[];
  /** accepted batches in order, with the version each produced */
  accepted: { batch: QueuedBatch; version: number }[];
  doc: JsonObject;
  version: number;
}

const refuse = (error: Refusal): BatchOutcome => ({ ok: false, error });

/**
 * Apply the batches in arrival order to the current document. Each is checked on its own: the
 * author's role now (not at join time), the session still open, not already committed, the
 * operations still apply (ids resolve), and the result is a valid sheet. A refused batch changes
 * nothing and does not stop the ones after it.
 */
export function decideGroup(state: LockedState, group: readonly QueuedBatch[]): Decision {
  let doc = state.doc;
  let version = state.version;
  const logged = new Map(Object.entries(state.logged));
  const accepted: Decision['accepted'] = [];
  const outcomes = group.map((batch): BatchOutcome => {
    const { request, author } = batch;
    const role = state.roles[String(author.id)];
    if (!role) return refuse({ code: 'not_found', message: 'No such project, or it is no longer shared with you. Ask its owner to invite you.' });
    if (!hasRole(role, 'editor'))
      return refuse({ code: 'forbidden', message: `Changing the sheet needs the editor role; you are a ${role}. Ask an owner to change your role.` });
    if (!state.liveSessions.has(batch.sessionId)) return refuse({ code: 'signed_out', message: 'You were signed out. Sign in again to keep editing.' });
    const seen = logged.get(request.batchId);
    if (seen !== undefined) return { ok: true, version: seen, duplicate: true };
    if (request.baseVersion > version || version - request.baseVersion > MAX_REBASE_SPAN)
      return refuse({
        code: 'stale',
        message: `Your copy of the sheet (version ${request.baseVersion}) is out of step with the server's (version ${version}); it will be reloaded.`,
        currentVersion: version,
      });
    const applied = applyOps(doc, request.ops);
    if (!applied.ok) return refuse({ code: applied.error.code, message: applied.error.message, opIndex: applied.error.opIndex, currentVersion: version });
    const parsed = parseSheet(applied.doc);
    if (!parsed.ok) return refuse({ code: 'invalid_sheet', message: parsed.error.message, issues: parsed.error.issues, currentVersion: version });
    doc = applied.doc;
    version += 1;
    logged.set(request.batchId, version);
    accepted.push({ batch, version });
    return { ok: true, version };
  });
  return { outcomes, accepted, doc, version };
}
