// socket.io on the app's own HTTP server: same origin, same session cookie, a room per project,
// and the PostgreSQL adapter so that several server processes behind a load balancer share rooms.
import type http from 'node:http';
import type { RequestHandler } from 'express';
import pg from 'pg';
import { Server } from 'socket.io';
import { createAdapter } from '@socket.io/postgres-adapter';
import type { Config } from '../config';
import type { Database } from '../db/client';
import { EVENTS, type OpBroadcast } from '../../shared/sync/protocol';
import { authenticateSockets, sameOriginOnly, useSessionsAtHandshake } from './handshake';
import { registerHandlers } from './handlers';
import { actOnNotice, recheckAll } from './notice-actions';
import { listenForNotices } from './notifications';
import { ProjectQueues } from './project-queues';
import { Timings } from './timings';
import { roomOf, type RealtimeIo } from './types';

export interface RealtimeDeps {
  config: Config;
  database: Database;
  /** the app's session cookie → user chain (`sessionHandlersOf(app)` from server/app.ts) */
  sessionHandlers: readonly RequestHandler[];
  /**
   * Share rooms with other processes through PostgreSQL (default). Off, rooms are this process's
   * only: right for a single process, wrong behind a load balancer.
   */
  clustered?: boolean;
}

export interface Realtime {
  io: RealtimeIo;
  /** Stop accepting sockets, let running commits finish, release the database connections. */
  close(): Promise<void>;
}

/** Largest message a client may send (bytes); as large as the REST API's JSON body. */
const MAX_MESSAGE_BYTES = 1_000_000;

/**
 * Works around @socket.io/postgres-adapter 0.5.0, which keeps one pooled client checked out for
 * LISTEN with no 'error' listener and never releases it when its connection ends (it just takes
 * a new one). Without this, losing the database raised an uncaught 'error' that ended the
 * process, and each outage leaked a pool slot, so `pool.end()` at shutdown never returned.
 * Only that client (the one with a 'notification' listener) is released here; clients of
 * `pool.query` are released by the pool itself.
 */
function keepAdapterPoolWhole(pool: pg.Pool): void {
  const checkedOut = new Set<pg.PoolClient>();
  pool.on('acquire', (client) => checkedOut.add(client));
  pool.on('release', (_err, client) => checkedOut.delete(client));
  pool.on('connect', (client) => {
    client.on('error', (err) => console.error(`realtime adapter: connection lost: ${err.message}`));
    client.once('end', () => {
      const pooled = client as pg.PoolClient;
      if (!checkedOut.has(pooled) || client.listenerCount('notification') === 0) return;
      checkedOut.delete(pooled);
      pooled.release(new Error('the LISTEN connection ended'));
    });
  });
}

export function attachRealtime(server: http.Server, deps: RealtimeDeps): Realtime {
  const { config, database } = deps;
  const clustered = deps.clustered ?? true;
  // The adapter holds a LISTEN connection for good; it gets a small pool of its own so the
  // app's pool keeps its full size.
  const adapterPool = clustered ? new pg.Pool({ connectionString: config.DATABASE_URL, max: 3 }) : null;
  adapterPool?.on('error', (err) => console.error(`realtime adapter: idle client error: ${err.message}`));
  if (adapterPool) keepAdapterPoolWhole(adapterPool);
  const io: RealtimeIo = new Server(server, {
    serveClient: false,
    maxHttpBufferSize: MAX_MESSAGE_BYTES,
    allowRequest: sameOriginOnly(config.PUBLIC_URL),
    ...(adapterPool
      ? { adapter: createAdapter(adapterPool, { tableName: 'socket_io_attachments', errorHandler: (err: Error) => console.error(`realtime adapter: ${err.message}`) }) }
      : {}),
  });

  // Benchmark-only switch (bench/realtime.bench.ts): answer `debug:timings` with server-side latencies.
  const timings = process.env.TAPLINE_REALTIME_TIMINGS === '1' ? new Timings() : null;
  const queues = new ProjectQueues(
    database.pool,
    (projectId, accepted) => {
      for (const { batch, version } of accepted) {
        const message: OpBroadcast = { projectId, version, ops: batch.request.ops, author: batch.author, batchId: batch.request.batchId };
        io.to(roomOf(projectId)).except(batch.socketId).emit(EVENTS.op, message);
      }
    },
    timings ? (ms) => timings.commit(ms) : undefined,
  );

  useSessionsAtHandshake(io, deps.sessionHandlers);
  authenticateSockets(io);
  io.on('connection', (socket) => registerHandlers(io, socket, { pool: database.pool, queues, timings }));

  const notices = listenForNotices(
    config.DATABASE_URL,
    (n) => void actOnNotice(io, database.pool, queues, n).catch((err) => console.error(`realtime: handling a ${n.kind} notice failed: ${(err as Error).message}`)),
    () => void recheckAll(io, database.pool).catch((err) => console.error(`realtime: re-checking sockets failed: ${(err as Error).message}`)),
  );

  return {
    io,
    async close() {
      await new Promise<void>((resolve) => io.close(() => resolve()));
      await queues.drained();
      queues.close();
      await notices.close();
      await adapterPool?.end();
    },
  };
}
