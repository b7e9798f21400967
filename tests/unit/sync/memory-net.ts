// An in-memory server and transport for the sync client's unit tests: the server decides with
// the same applyOps + parseSheet as the real one, keeps a log, and every message waits in a
// per-direction FIFO queue (as on one socket.io connection) until the test delivers it.
import { parseSheet } from '../../../shared/sheet';
import {
  applyOps,
  normalizeForSync,
  type JoinAck,
  type JoinRequest,
  type JsonObject,
  type OpAck,
  type OpBroadcast,
  type OpRequest,
  type PresenceUpdate,
  type Role,
  type SyncTransport,
  type TransportEvents,
  type LoggedBatch,
} from '../../../shared/sync';

export class MemoryServer {
  doc: JsonObject;
  version = 1;
  log: LoggedBatch[] = [];
  readonly initial: JsonObject;
  readonly transports = new Set<MemoryTransport>();
  roles = new Map<string, Role>();

  constructor(sheet: JsonObject) {
    this.doc = normalizeForSync(sheet);
    this.initial = this.doc;
  }

  join(t: MemoryTransport, req: JoinRequest): JoinAck {
    const role = this.roles.get(t.user) ?? 'editor';
    t.joined = true;
    const missed = req.sinceVersion === undefined ? undefined : this.log.filter((b) => b.version > req.sinceVersion!);
    const committed = (req.pendingBatchIds ?? []).flatMap((id) => this.log.filter((b) => b.batchId === id).map((b) => ({ batchId: id, version: b.version })));
    return { ok: true, version: this.version, sheet: this.doc, role, peers: [], missed, committed };
  }

  op(t: MemoryTransport, req: OpRequest): OpAck {
    if ((this.roles.get(t.user) ?? 'editor') === 'viewer') return { ok: false, error: { code: 'forbidden', message: 'viewers cannot edit' } };
    const dup = this.log.find((b) => b.batchId === req.batchId);
    if (dup) return { ok: true, version: dup.version, duplicate: true };
    const r = applyOps(this.doc, req.ops);
    if (!r.ok) return { ok: false, error: { code: r.error.code, message: r.error.message, opIndex: r.error.opIndex } };
    const parsed = parseSheet(r.doc);
    if (!parsed.ok) return { ok: false, error: { code: 'invalid_sheet', message: parsed.error.message } };
    this.doc = r.doc;
    this.version += 1;
    const entry: LoggedBatch = { version: this.version, ops: req.ops, batchId: req.batchId, author: { id: 0, login: t.user, name: null, avatarUrl: null } };
    this.log.push(entry);
    for (const other of this.transports) if (other !== t && other.joined && other.connected) other.deliver(() => other.fire('op', { ...entry, projectId: req.projectId } as OpBroadcast));
    return { ok: true, version: this.version };
  }
}

type Handlers = Partial<TransportEvents>;

export class MemoryTransport implements SyncTransport {
  connected = true;
  joined = false;
  toServer: (() => void)[] = [];
  toClient: (() => void)[] = [];
  private handlers = new Set<Handlers>();
  private waiting = new Set<(err: Error) => void>();
  /** every batch the server acknowledged as accepted, by id */
  readonly accepted = new Map<string, number>();

  constructor(
    readonly server: MemoryServer,
    readonly user: string,
  ) {
    server.transports.add(this);
  }

  fire<K extends keyof TransportEvents>(event: K, ...args: Parameters<TransportEvents[K]>): void {
    for (const h of [...this.handlers]) (h[event] as ((...a: Parameters<TransportEvents[K]>) => void) | undefined)?.(...args);
  }

  deliver(f: () => void): void {
    this.toClient.push(f);
  }

  private request<A>(handle: () => A, onAck?: (a: A) => void): Promise<A> {
    if (!this.connected) return Promise.reject(new Error('offline'));
    return new Promise<A>((resolve, reject) => {
      this.waiting.add(reject);
      this.toServer.push(() => {
        const ack = handle();
        onAck?.(ack);
        this.toClient.push(() => {
          this.waiting.delete(reject);
          resolve(ack);
        });
      });
    });
  }

  join(request: JoinRequest): Promise<JoinAck> {
    return this.request(() => this.server.join(this, request));
  }

  sendOps(request: OpRequest): Promise<OpAck> {
    return this.request(
      () => this.server.op(this, request),
      (ack) => ack.ok && this.accepted.set(request.batchId, ack.version),
    );
  }

  sendPresence(_update: PresenceUpdate): void {}
  leave(): void {
    this.joined = false;
  }
  listen(handlers: Handlers): () => void {
    this.handlers.add(handlers);
    return () => this.handlers.delete(handlers);
  }
  close(): void {
    this.connected = false;
  }

  /** The connection drops: messages to the server may or may not have arrived, answers are lost. */
  drop(deliverOutgoing: boolean): void {
    if (deliverOutgoing) for (const f of this.toServer.splice(0)) f();
    this.toServer = [];
    this.toClient = [];
    this.connected = false;
    this.joined = false;
    for (const reject of this.waiting) reject(new Error('connection lost'));
    this.waiting.clear();
    this.fire('down', 'test');
  }

  reconnect(): void {
    this.connected = true;
    this.fire('up');
  }
}

/** Deterministic pseudo-random numbers (mulberry32) so a failing run can be replayed from its seed. */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Let promise callbacks run (the client awaits its transport). */
export async function settle(): Promise<void> {
  for (let i = 0; i < 5; i++) await Promise.resolve();
}
