// The socket events of one connection: join, leave, operations, presence.
import type pg from 'pg';
import {
  describeInvalid,
  EVENTS,
  JoinRequestSchema,
  LeaveRequestSchema,
  OpRequestSchema,
  PresenceUpdateSchema,
  type JoinAck,
  type OpAck,
  type Peer,
} from '../../shared/sync/protocol';
import { findUnstorable } from '../sheets/storable-json';
import { readForJoin, readRole } from './join-read';
import type { ProjectQueues } from './project-queues';
import type { Timings } from './timings';
import { TokenBucket } from './rate-limit';
import { roomOf, type RealtimeIo, type RealtimeSocket } from './types';

const notFound = { code: 'not_found', message: 'No such project, or it is not shared with you. Check the link, or ask its owner to invite you.' } as const;
const notJoined = { code: 'not_joined', message: 'Open the sheet first (sheet:join).' } as const;
const unavailable = { code: 'unavailable', message: 'The server could not read the sheet (database unavailable). Try again in a moment.' } as const;

/** How long a join waits for the other server processes to list their sockets, ms. */
const PEER_LIST_TIMEOUT_MS = 1000;

/** A safe ack: a client that sent no callback gets nothing, and never a stack trace. */
function answer<T>(ack: unknown): (value: T) => void {
  return typeof ack === 'function' ? (v: T) => (ack as (value: T) => void)(v) : () => undefined;
}

export function peerOf(socket: { id: string; data: RealtimeSocket['data'] }, projectId: string): Peer | null {
  const joined = socket.data.projects?.[projectId];
  if (!joined) return null;
  return { clientId: socket.id, user: socket.data.user, role: joined.role, cursor: joined.cursor, selection: joined.selection };
}

async function listPeers(io: RealtimeIo, socket: RealtimeSocket, projectId: string): Promise<Peer[]> {
  const room = roomOf(projectId);
  let sockets;
  try {
    sockets = await io.in(room).timeout(PEER_LIST_TIMEOUT_MS).fetchSockets();
  } catch {
    // Another process did not answer in time (it may just have died): list ours; the others
    // appear with their next presence update.
    sockets = await io.local.in(room).fetchSockets();
  }
  return sockets.filter((s) => s.id !== socket.id).flatMap((s) => peerOf(s, projectId) ?? []);
}

/** Tell the others in a project that this socket left it. */
export function announceLeave(io: RealtimeIo, socket: RealtimeSocket, projectId: string): void {
  io.to(roomOf(projectId)).except(socket.id).emit(EVENTS.presenceLeave, { projectId, clientId: socket.id });
}

export function registerHandlers(io: RealtimeIo, socket: RealtimeSocket, deps: { pool: pg.Pool; queues: ProjectQueues; timings: Timings | null }): void {
  socket.on(EVENTS.join, async (raw, ack) => {
    const reply = answer<JoinAck>(ack);
    const parsed = JoinRequestSchema.safeParse(raw);
    if (!parsed.success) return reply({ ok: false, error: { code: 'invalid_request', message: describeInvalid(parsed.error) } });
    const { projectId, sinceVersion, pendingBatchIds } = parsed.data;
    const room = roomOf(projectId);
    try {
      // A non-member never enters the room. A member enters it before the sheet is read, so a
      // batch committed after the read is broadcast to them (one before it is in the sheet).
      if (!socket.data.projects[projectId] && !(await readRole(deps.pool, projectId, socket.data.user.id))) return reply({ ok: false, error: notFound });
      await socket.join(room);
      const read = await readForJoin(deps.pool, { projectId, userId: socket.data.user.id, sinceVersion, pendingBatchIds, cached: deps.queues.cached(projectId) });
      if (!read) {
        delete socket.data.projects[projectId];
        await socket.leave(room);
        return reply({ ok: false, error: notFound });
      }
      const previous = socket.data.projects[projectId];
      socket.data.projects[projectId] = { role: read.role, cursor: previous?.cursor ?? null, selection: previous?.selection ?? { parts: [], wires: [] } };
      const peers = await listPeers(io, socket, projectId);
      socket.to(room).emit(EVENTS.presence, { projectId, peer: peerOf(socket, projectId)! });
      reply({ ok: true, version: read.version, sheet: read.sheet, role: read.role, peers, missed: read.missed, committed: read.committed });
    } catch (err) {
      console.error(`realtime: join of project ${projectId} failed: ${(err as Error).message}`);
      if (!socket.data.projects[projectId]) await socket.leave(room);
      reply({ ok: false, error: unavailable });
    }
  });

  socket.on(EVENTS.leave, async (raw) => {
    const parsed = LeaveRequestSchema.safeParse(raw);
    if (!parsed.success || !socket.data.projects[parsed.data.projectId]) return;
    const { projectId } = parsed.data;
    delete socket.data.projects[projectId];
    await socket.leave(roomOf(projectId));
    announceLeave(io, socket, projectId);
  });

  const bucket = new TokenBucket();
  socket.on(EVENTS.op, async (raw, ack) => {
    const done = deps.timings?.start();
    const reply = answer<OpAck>(ack);
    // 'unavailable' makes the client keep the batch and send it again a moment later.
    if (!bucket.take()) return reply({ ok: false, error: { code: 'unavailable', message: 'Too many changes at once; they are sent again in a moment.' } });
    // Before zod: its recursive JSON schema overflows the stack on deep nesting, and text jsonb
    // cannot store (NUL, lone surrogates) would fail the commit as 'unavailable', resent for ever.
    const unstorable = findUnstorable(raw);
    if (unstorable) return reply({ ok: false, error: { code: 'invalid_request', message: `The message is malformed: ${unstorable.message}` } });
    const parsed = OpRequestSchema.safeParse(raw);
    if (!parsed.success) return reply({ ok: false, error: { code: 'invalid_request', message: describeInvalid(parsed.error) } });
    const request = parsed.data;
    if (!socket.data.projects[request.projectId]) return reply({ ok: false, error: notJoined });
    // The role is checked again inside the commit, against the membership row, on every batch.
    const outcome = await deps.queues.submit(request.projectId, { request, author: socket.data.user, sessionId: socket.data.sessionId, socketId: socket.id });
    done?.();
    if (!outcome.ok && outcome.error.code === 'not_found') {
      delete socket.data.projects[request.projectId];
      await socket.leave(roomOf(request.projectId));
    }
    reply(outcome);
  });

  socket.on(EVENTS.presenceUpdate, (raw) => {
    const parsed = PresenceUpdateSchema.safeParse(raw);
    if (!parsed.success) return;
    const { projectId, cursor, selection } = parsed.data;
    // Membership and role are kept current by the database's notifications (notifications.ts).
    const joined = socket.data.projects[projectId];
    if (!joined) return;
    if (cursor !== undefined) joined.cursor = cursor;
    if (selection !== undefined) joined.selection = selection;
    // volatile: under back-pressure a cursor position is dropped rather than queued.
    socket.to(roomOf(projectId)).volatile.emit(EVENTS.presence, { projectId, peer: peerOf(socket, projectId)! });
  });

  if (deps.timings) {
    const timings = deps.timings;
    socket.on('debug:timings', (ack) => typeof ack === 'function' && ack(timings.take()));
  }

  socket.on('disconnecting', () => {
    for (const projectId of Object.keys(socket.data.projects ?? {})) announceLeave(io, socket, projectId);
  });
}
