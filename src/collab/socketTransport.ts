// The sync client's transport over socket.io: the browser's connection to the same origin (the
// session cookie goes with the handshake), or, in Node tests and the bench, any URL with a cookie.
import { io, type ManagerOptions, type Socket, type SocketOptions } from 'socket.io-client';
import {
  EVENTS,
  SYNC_PROTOCOL_VERSION,
  type JoinAck,
  type JoinRequest,
  type OpAck,
  type OpRequest,
  type PresenceUpdate,
} from '../../shared/sync/protocol';
import type { SyncTransport, TransportEvents } from '../../shared/sync/transport';

/** How long to wait for the server's answer before treating the request as lost, ms. */
const ACK_TIMEOUT_MS = 15_000;

export interface SocketTransportOptions {
  /** server origin; default: the page's own */
  url?: string;
  /** Node only: the session cookie (`tapline.sid=...`); a browser sends its own */
  cookie?: string;
  /** extra socket.io-client options (tests shorten the reconnection delays) */
  socket?: Partial<ManagerOptions & SocketOptions>;
}

/** Why a handshake was refused, as the server put it (`signed_out`, `protocol`). */
export interface ConnectRefusal {
  code: string;
  message: string;
}

export class SocketTransport implements SyncTransport {
  readonly socket: Socket;
  private handlers = new Set<Partial<TransportEvents & { refused(r: ConnectRefusal): void }>>();

  constructor(options: SocketTransportOptions = {}) {
    const opts: Partial<ManagerOptions & SocketOptions> = {
      auth: { protocol: SYNC_PROTOCOL_VERSION },
      withCredentials: true,
      ...(options.cookie ? { extraHeaders: { cookie: options.cookie }, transports: ['websocket'] } : {}),
      ...options.socket,
    };
    this.socket = options.url ? io(options.url, opts) : io(opts);
    const s = this.socket;
    s.on('connect', () => this.fire('up'));
    // After 'io server disconnect' (the server ended the session) socket.io does not reconnect by itself.
    s.on('disconnect', (reason) => this.fire('down', reason));
    s.on('connect_error', (err: Error & { data?: ConnectRefusal }) => {
      if (err.data?.code) for (const h of [...this.handlers]) h.refused?.(err.data);
    });
    s.on(EVENTS.op, (m) => this.fire('op', m));
    s.on(EVENTS.presence, (m) => this.fire('presence', m));
    s.on(EVENTS.presenceLeave, (m) => this.fire('presenceLeave', m));
    s.on(EVENTS.role, (m) => this.fire('role', m));
    s.on(EVENTS.closed, (m) => this.fire('closed', m));
    s.on(EVENTS.sessionEnded, (m: { reason: string }) => this.fire('sessionEnded', m.reason));
  }

  get connected(): boolean {
    return this.socket.connected;
  }

  private fire<K extends keyof TransportEvents>(event: K, ...args: Parameters<TransportEvents[K]>): void {
    for (const h of [...this.handlers]) (h[event] as ((...a: Parameters<TransportEvents[K]>) => void) | undefined)?.(...args);
  }

  private request<A>(event: string, payload: unknown): Promise<A> {
    // socket.io-client would buffer a message sent while offline and deliver it on reconnect;
    // the sync client re-sends after its rejoin instead, so refuse here.
    if (!this.socket.connected) return Promise.reject(new Error('not connected'));
    return this.socket.timeout(ACK_TIMEOUT_MS).emitWithAck(event, payload) as Promise<A>;
  }

  join(request: JoinRequest): Promise<JoinAck> {
    return this.request(EVENTS.join, request);
  }

  sendOps(request: OpRequest): Promise<OpAck> {
    return this.request(EVENTS.op, request);
  }

  sendPresence(update: PresenceUpdate): void {
    if (this.socket.connected) this.socket.volatile.emit(EVENTS.presenceUpdate, update);
  }

  leave(projectId: string): void {
    if (this.socket.connected) this.socket.emit(EVENTS.leave, { projectId });
  }

  listen(handlers: Partial<TransportEvents & { refused(r: ConnectRefusal): void }>): () => void {
    this.handlers.add(handlers);
    return () => this.handlers.delete(handlers);
  }

  close(): void {
    this.socket.close();
  }
}
