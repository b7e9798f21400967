// What the sync client needs from the network, so the same client logic runs over socket.io in
// the browser, over socket.io in Node tests, and over an in-memory pipe in unit tests.
import type {
  JoinAck,
  JoinRequest,
  OpAck,
  OpBroadcast,
  OpRequest,
  PresenceBroadcast,
  PresenceLeave,
  PresenceUpdate,
  RoleChanged,
  SheetClosed,
} from './protocol';

export interface TransportEvents {
  op(message: OpBroadcast): void;
  presence(message: PresenceBroadcast): void;
  presenceLeave(message: PresenceLeave): void;
  role(message: RoleChanged): void;
  closed(message: SheetClosed): void;
  /** the server ended this session (signed out elsewhere, or the session expired) */
  sessionEnded(reason: string): void;
  /** the connection came up (first time or again) */
  up(): void;
  /** the connection dropped; the transport keeps trying to reconnect */
  down(reason: string): void;
}

/** Rejected `join`/`sendOps` promises mean "no answer" (connection lost, timeout), never a refusal. */
export interface SyncTransport {
  readonly connected: boolean;
  join(request: JoinRequest): Promise<JoinAck>;
  sendOps(request: OpRequest): Promise<OpAck>;
  sendPresence(update: PresenceUpdate): void;
  leave(projectId: string): void;
  /** Subscribe to events; returns an unsubscribe function. */
  listen(handlers: Partial<TransportEvents>): () => void;
  /** Close the connection for good. */
  close(): void;
}
