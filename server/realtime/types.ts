// socket.io typed for the co-editing protocol (shared/sync/protocol.ts).
import type { Server, Socket } from 'socket.io';
import type { TimingSummary } from './timings';
import type {
  JoinAck,
  OpAck,
  OpBroadcast,
  Point,
  PresenceBroadcast,
  PresenceLeave,
  Role,
  RoleChanged,
  SelectionIds,
  SheetClosed,
  UserSummary,
} from '../../shared/sync/protocol';

// Payloads arrive as `unknown` and are checked with the protocol's zod schemas.
export interface ClientToServerEvents {
  'sheet:join': (request: unknown, ack: (answer: JoinAck) => void) => void;
  'sheet:leave': (request: unknown) => void;
  'sheet:op': (request: unknown, ack: (answer: OpAck) => void) => void;
  'presence:update': (request: unknown) => void;
  /** benchmark only (TAPLINE_REALTIME_TIMINGS=1): server-side timings since the last call */
  'debug:timings': (ack: (summary: TimingSummary) => void) => void;
}

export interface ServerToClientEvents {
  'sheet:op': (message: OpBroadcast) => void;
  presence: (message: PresenceBroadcast) => void;
  'presence:leave': (message: PresenceLeave) => void;
  'sheet:role': (message: RoleChanged) => void;
  'sheet:closed': (message: SheetClosed) => void;
  'session:ended': (message: { reason: string }) => void;
}

// eslint-disable-next-line @typescript-eslint/no-empty-object-type
export interface InterServerEvents {}

/** What this socket has open in one project. Plain data: the adapter copies it between processes (fetchSockets). */
export interface JoinedProject {
  role: Role;
  cursor: Point | null;
  selection: SelectionIds;
}

export interface SocketData {
  user: UserSummary;
  /** the express-session id the socket was opened with; its end (sign-out) closes the socket */
  sessionId: string;
  projects: Record<string, JoinedProject>;
}

export type RealtimeIo = Server<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;
export type RealtimeSocket = Socket<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;

/** The socket.io room of a project. */
export function roomOf(projectId: string): string {
  return `project:${projectId}`;
}
