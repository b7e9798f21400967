// The co-editing protocol: its version, the socket.io event names, every message in both
// directions, and what the server answers to a push. The server validates what clients send with
// the schemas at the bottom; both sides share the types.
import { z } from 'zod';
import type { JsonObject, SheetOp } from './ops';

/** Bumped on any incompatible change; a client of another version is told to reload. */
export const SYNC_PROTOCOL_VERSION = 1;

export const EVENTS = {
  /** C→S `JoinRequest`, ack `JoinAck` */
  join: 'sheet:join',
  /** C→S `{ projectId }`: stop receiving a sheet's operations and presence */
  leave: 'sheet:leave',
  /** C→S `OpRequest`, ack `OpAck`; S→C `OpBroadcast` to the others in the project */
  op: 'sheet:op',
  /** C→S `PresenceUpdate` (no ack) */
  presenceUpdate: 'presence:update',
  /** S→C `PresenceBroadcast` */
  presence: 'presence',
  /** S→C `PresenceLeave`: a peer closed the sheet or lost its connection */
  presenceLeave: 'presence:leave',
  /** S→C `RoleChanged`: an owner changed this user's role */
  role: 'sheet:role',
  /** S→C `SheetClosed`: removed from the project, or the project was deleted */
  closed: 'sheet:closed',
  /** S→C `{ reason }` just before the server closes a socket whose session ended (signed out) */
  sessionEnded: 'session:ended',
} as const;

export type Role = 'owner' | 'editor' | 'viewer';

export interface UserSummary {
  id: number;
  login: string;
  name: string | null;
  avatarUrl: string | null;
}

/** Canvas units. */
export interface Point {
  x: number;
  y: number;
}

export interface SelectionIds {
  parts: string[];
  wires: string[];
}

// ---- client → server

export interface JoinRequest {
  projectId: string;
  /** the version the client already has (a rejoin after a reconnect): the ack lists what came after */
  sinceVersion?: number;
  /** batches sent but never acknowledged: the ack says which of them the server did commit */
  pendingBatchIds?: string[];
}

export interface OpRequest {
  projectId: string;
  /** the server version the batch was made against (the server rebases it from there) */
  baseVersion: number;
  /** unique per batch (client id + sequence); a batch sent twice is committed once */
  batchId: string;
  ops: SheetOp[];
}

export interface PresenceUpdate {
  projectId: string;
  cursor?: Point | null;
  selection?: SelectionIds;
}

// ---- server → client

export type RefusalCode =
  /** the caller's role does not allow this (a viewer sending operations) */
  | 'forbidden'
  /** no such project, or the caller is not a member */
  | 'not_found'
  /** the session ended */
  | 'signed_out'
  /** the batch no longer applies to the current document (a part it changes was removed…) */
  | 'conflict'
  /** the result would not be a valid sheet; `issues` name the part and field */
  | 'invalid_sheet'
  /** the message is malformed */
  | 'invalid_request'
  /** `sheet:op` or presence for a project this socket has not joined */
  | 'not_joined'
  /** the client's version is too far behind (or ahead): join again */
  | 'stale'
  /** the database did not answer; try again */
  | 'unavailable';

export interface Refusal {
  code: RefusalCode;
  /** what happened and what to do, for a person */
  message: string;
  /** the operation of the batch that failed */
  opIndex?: number;
  issues?: { path: string; partId?: string; field?: string; message: string }[];
  currentVersion?: number;
}

export interface Peer {
  /** one per open sheet (socket id): the same person in two tabs is two peers */
  clientId: string;
  user: UserSummary;
  role: Role;
  cursor: Point | null;
  selection: SelectionIds;
}

/** One accepted batch, as stored in the operation log. */
export interface LoggedBatch {
  version: number;
  ops: SheetOp[];
  /** null for changes made by the system, or by a user since deleted */
  author: UserSummary | null;
  batchId: string | null;
}

export type JoinAck =
  | {
      ok: true;
      version: number;
      /** the document at `version` (wire ids filled in, see normalizeForSync) */
      sheet: JsonObject;
      role: Role;
      peers: Peer[];
      /** batches after `sinceVersion`, oldest first, when asked for and the log is not too long */
      missed?: LoggedBatch[];
      /** which of `pendingBatchIds` are already in the log, and at which version */
      committed?: { batchId: string; version: number }[];
    }
  | { ok: false; error: Refusal };

export type OpAck = { ok: true; version: number; duplicate?: boolean } | { ok: false; error: Refusal };

export interface OpBroadcast extends LoggedBatch {
  projectId: string;
}

export interface PresenceBroadcast {
  projectId: string;
  peer: Peer;
}

export interface PresenceLeave {
  projectId: string;
  clientId: string;
}

export interface RoleChanged {
  projectId: string;
  role: Role;
}

export interface SheetClosed {
  projectId: string;
  reason: 'removed' | 'deleted';
  message: string;
}

// ---- validation of what clients send

/** Largest batch the server takes; a paste of a few hundred parts with their wires fits. */
export const MAX_OPS_PER_BATCH = 2000;
/** How far behind a batch's baseVersion may be before the client is asked to join again. */
export const MAX_REBASE_SPAN = 10_000;

const FieldKey = z
  .string()
  .min(1)
  .max(64)
  .refine((k) => k !== '__proto__' && k !== 'prototype' && k !== 'constructor', 'is not an allowed field name');
const FieldPathSchema = z.array(FieldKey).min(1).max(8);
const ElementId = z.string().min(1).max(100);
const Coll = z.enum(['parts', 'wires']);
const JsonObjectSchema = z.record(z.string(), z.json());

export const SheetOpSchema = z.discriminatedUnion('op', [
  z.strictObject({ op: z.literal('insert'), coll: Coll, value: JsonObjectSchema, after: ElementId.nullable() }),
  z.strictObject({ op: z.literal('remove'), coll: Coll, id: ElementId }),
  z.strictObject({ op: z.literal('move'), coll: Coll, id: ElementId, after: ElementId.nullable() }),
  z.strictObject({
    op: z.literal('set'),
    target: z.union([z.literal('sheet'), z.strictObject({ coll: Coll, id: ElementId })]),
    path: FieldPathSchema,
    value: z.json(),
  }),
  z.strictObject({
    op: z.literal('unset'),
    target: z.union([z.literal('sheet'), z.strictObject({ coll: Coll, id: ElementId })]),
    path: FieldPathSchema,
  }),
  // replaceSheet is written by the server only (REST saves, restores); clients never send it.
]);

const ProjectId = z.uuid({ message: 'must be a project id (a UUID)' });
const Version = z.number().int().min(0);
const BatchId = z.string().min(8).max(100);

export const JoinRequestSchema = z.strictObject({
  projectId: ProjectId,
  sinceVersion: Version.optional(),
  pendingBatchIds: z.array(BatchId).max(1000).optional(),
});

export const OpRequestSchema = z.strictObject({
  projectId: ProjectId,
  baseVersion: Version,
  batchId: BatchId,
  ops: z.array(SheetOpSchema).min(1).max(MAX_OPS_PER_BATCH),
});

const Coordinate = z.number().min(-1e7).max(1e7);
export const PresenceUpdateSchema = z.strictObject({
  projectId: ProjectId,
  cursor: z.strictObject({ x: Coordinate, y: Coordinate }).nullable().optional(),
  selection: z.strictObject({ parts: z.array(ElementId).max(2000), wires: z.array(ElementId).max(2000) }).optional(),
});

export const LeaveRequestSchema = z.strictObject({ projectId: ProjectId });

/** A readable one-line reason for a malformed message: "ops.0.path: is not an allowed field name". */
export function describeInvalid(error: z.ZodError): string {
  const first = error.issues[0];
  if (!first) return 'The message is malformed.';
  const where = first.path.map(String).join('.');
  return `The message is malformed${where ? ` at ${where}` : ''}: ${first.message}.`;
}
