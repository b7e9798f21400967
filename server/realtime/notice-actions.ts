// What a server process does with a database notice, for its own sockets.
import type pg from 'pg';
import { EVENTS } from '../../shared/sync/protocol';
import { announceLeave } from './handlers';
import { readLogged } from './join-read';
import type { DatabaseNotice } from './notifications';
import type { ProjectQueues } from './project-queues';
import { roomOf, type RealtimeIo, type RealtimeSocket } from './types';

function localSockets(io: RealtimeIo): RealtimeSocket[] {
  return [...io.of('/').sockets.values()];
}

/** End a socket whose session is gone: tell it why, then close it. */
function endSession(socket: RealtimeSocket): void {
  socket.emit(EVENTS.sessionEnded, { reason: 'signed_out' });
  socket.disconnect(true);
}

async function removeFromProject(io: RealtimeIo, pool: pg.Pool, socket: RealtimeSocket, projectId: string): Promise<void> {
  const { rowCount } = await pool.query('select 1 from projects where id = $1', [projectId]);
  const deleted = !rowCount;
  delete socket.data.projects[projectId];
  await socket.leave(roomOf(projectId));
  announceLeave(io, socket, projectId);
  socket.emit(EVENTS.closed, {
    projectId,
    reason: deleted ? 'deleted' : 'removed',
    message: deleted ? 'This project was deleted by its owner.' : 'You were removed from this project, so the sheet is closed.',
  });
}

type MembershipNotice = Extract<DatabaseNotice, { kind: 'membership' }>;

async function onMembership(io: RealtimeIo, pool: pg.Pool, notice: MembershipNotice): Promise<void> {
  for (const s of localSockets(io)) {
    if (s.data.user?.id !== notice.userId || !s.data.projects?.[notice.projectId]) continue;
    if (notice.role === null) await removeFromProject(io, pool, s, notice.projectId);
    else if (s.data.projects[notice.projectId].role !== notice.role) {
      s.data.projects[notice.projectId].role = notice.role;
      s.emit(EVENTS.role, { projectId: notice.projectId, role: notice.role });
    }
  }
}

export async function actOnNotice(io: RealtimeIo, pool: pg.Pool, queues: ProjectQueues, notice: DatabaseNotice): Promise<void> {
  switch (notice.kind) {
    case 'sheet': {
      // A change that did not come through the live path (REST save, restore): the trigger
      // logged it as a replaceSheet batch; pass it on like any other.
      queues.invalidate(notice.projectId, notice.version);
      const logged = await readLogged(pool, notice.projectId, notice.version);
      if (logged) io.local.to(roomOf(notice.projectId)).emit(EVENTS.op, { ...logged, projectId: notice.projectId });
      return;
    }
    case 'session':
      for (const s of localSockets(io)) if (s.data.sessionId === notice.sid) endSession(s);
      return;
    case 'membership':
      return onMembership(io, pool, notice);
  }
}

/** After the notice connection was lost for a while: re-check sessions and memberships of our sockets. */
export async function recheckAll(io: RealtimeIo, pool: pg.Pool): Promise<void> {
  const sockets = localSockets(io).filter((s) => s.data.sessionId);
  if (!sockets.length) return;
  const live = await pool.query<{ sid: string }>('select sid from session where sid = any($1::text[]) and expire > now()', [sockets.map((s) => s.data.sessionId)]);
  const alive = new Set(live.rows.map((r) => r.sid));
  for (const s of sockets) {
    if (!alive.has(s.data.sessionId)) {
      endSession(s);
      continue;
    }
    for (const projectId of Object.keys(s.data.projects)) {
      const { rows } = await pool.query<{ role: MembershipNotice['role'] }>('select role from memberships where project_id = $1 and user_id = $2', [projectId, s.data.user.id]);
      await onMembership(io, pool, { kind: 'membership', projectId, userId: s.data.user.id, role: rows[0]?.role ?? null });
    }
  }
}
