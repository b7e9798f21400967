// Who is on the other end of a socket: the same session cookie as the HTTP API, read with the
// same express-session middleware and store, once, at the handshake.
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import '../auth/current-user';
import type { RealtimeIo } from './types';
import { SYNC_PROTOCOL_VERSION } from '../../shared/sync/protocol';

type EngineRequest = IncomingMessage & { _query?: Record<string, string>; user?: Express.User; sessionID?: string };

/**
 * The app's session chain (express-session with its PostgreSQL store, passport) runs on the
 * handshake request only; the later polling requests of the same socket carry the engine's sid.
 */
export function useSessionsAtHandshake(io: RealtimeIo, handlers: readonly RequestHandler[]): void {
  for (const handler of handlers) {
    io.engine.use((req: EngineRequest, res: ServerResponse, next: (err?: unknown) => void) => {
      if (req._query?.sid === undefined) handler(req as never, res as never, next as never);
      else next();
    });
  }
}

/**
 * Cross-site WebSocket hijacking guard: browsers send cookies on a WebSocket handshake to any
 * origin, so a page elsewhere could open one with our user's session. A browser always sends
 * Origin; it must be this server (as the browser reached it) or PUBLIC_URL. Scripts send none.
 */
export function sameOriginOnly(publicUrl: string | undefined) {
  const allowed = publicUrl ? new URL(publicUrl).origin : null;
  return (req: IncomingMessage, callback: (err: string | null | undefined, success: boolean) => void) => {
    const origin = req.headers.origin;
    if (!origin) return callback(null, true);
    let host: string;
    try {
      host = new URL(origin).host;
    } catch {
      return callback('origin not allowed', false);
    }
    const forwarded = String(req.headers['x-forwarded-host'] ?? '').split(',')[0].trim();
    const ok = origin === allowed || host === req.headers.host || (forwarded !== '' && host === forwarded);
    callback(ok ? null : 'origin not allowed', ok);
  };
}

/** A handshake error the client can tell apart (`err.data.code`) and show. */
function refuse(code: 'signed_out' | 'protocol', message: string): Error {
  return Object.assign(new Error(message), { data: { code, message } });
}

/** Refuse sockets without a signed-in session or of another protocol version; fill `socket.data`. */
export function authenticateSockets(io: RealtimeIo): void {
  io.use((socket, next) => {
    const protocol = (socket.handshake.auth as { protocol?: unknown } | undefined)?.protocol;
    if (protocol !== undefined && protocol !== SYNC_PROTOCOL_VERSION)
      return next(refuse('protocol', 'Tapline was updated: reload the page to keep editing together.'));
    const req = socket.request as EngineRequest;
    // passport put the user here, read afresh from the users table (a deleted user is signed out).
    const user = req.user;
    if (!user || !req.sessionID) return next(refuse('signed_out', 'You are not signed in. Sign in and open the sheet again.'));
    socket.data.user = { id: user.id, login: user.login, name: user.name, avatarUrl: user.avatarUrl };
    socket.data.sessionId = req.sessionID;
    socket.data.projects = {};
    next();
  });
}
