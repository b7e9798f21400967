// The client half of co-editing, free of any UI or network library. It keeps
//   confirmed — the server's document at `version`, built only from what the server sent, in the
//               server's order (so it always equals the database once caught up);
//   pending   — this user's batches not yet acknowledged, oldest first (one of them in flight);
//   local     — confirmed with pending applied: what this user sees.
// Local edits show at once; every server message moves `confirmed` on and `local` is rebuilt on
// top of it, so pending edits survive remote edits, refusals and reconnects wherever they still apply.
import { applyOps, type ApplyResult } from './apply';
import { normalizeForSync } from './normalize';
import type { JsonObject, SheetOp } from './ops';
import { PresenceBook, type KnownPeer } from './presence';
import { MAX_OPS_PER_BATCH, type OpAck, type OpBroadcast, type Point, type Refusal, type Role, type SelectionIds } from './protocol';
import type { SyncTransport } from './transport';

export type SyncStatus =
  /** joining for the first time */
  | 'connecting'
  /** joined; edits flow */
  | 'live'
  /** connection lost; edits are kept and sent when it returns */
  | 'offline'
  /** the server closed the sheet for this user (removed from the project, project deleted, signed out) */
  | 'closed';

export interface SyncNotice {
  kind: 'refused' | 'dropped' | 'closed' | 'role';
  message: string;
}

export type DocumentCause = 'load' | 'remote' | 'rebase';

export interface SyncClientEvents {
  /** `local` changed for a reason other than this user's own push */
  document(doc: JsonObject, cause: DocumentCause): void;
  status(status: SyncStatus): void;
  role(role: Role): void;
  peers(peers: KnownPeer[]): void;
  notice(notice: SyncNotice): void;
}

export interface SyncClientOptions {
  projectId: string;
  transport: SyncTransport;
  /** A check the result of a pending batch must pass to be kept when it is re-applied after a refusal or a reconnect (the server checks parseSheet). */
  validate?: (doc: JsonObject) => boolean;
  /** Prefix of batch ids; unique per open sheet. */
  clientId?: string;
  /** ms to wait for a missing version (an out-of-order broadcast) before joining again */
  gapTimeoutMs?: number;
  /** ms between presence messages (cursor moves are coalesced) */
  presenceIntervalMs?: number;
  /** ms a departed peer stays visible */
  peerFadeMs?: number;
}

interface PendingBatch {
  batchId: string;
  ops: SheetOp[];
  /** the batches a coalesced one was made of (retried one by one if it is refused) */
  parts?: PendingBatch[];
  /** send alone (it was part of a refused coalesced batch) */
  solo?: boolean;
}

/** Longest run of queued batches sent as one message. */
const MAX_COALESCE = 64;

function randomId(): string {
  const c = (globalThis as { crypto?: { randomUUID?: () => string } }).crypto;
  return c?.randomUUID ? c.randomUUID().replace(/-/g, '').slice(0, 16) : Math.random().toString(36).slice(2, 18).padEnd(16, '0');
}

type Listeners = { [K in keyof SyncClientEvents]: Set<SyncClientEvents[K]> };

export class SyncClient {
  readonly projectId: string;
  private readonly transport: SyncTransport;
  private readonly validate: (doc: JsonObject) => boolean;
  private readonly clientId: string;
  private readonly gapTimeoutMs: number;
  private readonly presenceIntervalMs: number;
  private readonly presenceBook: PresenceBook;
  private readonly listeners: Listeners = { document: new Set(), status: new Set(), role: new Set(), peers: new Set(), notice: new Set() };

  private _status: SyncStatus = 'connecting';
  private _role: Role = 'viewer';
  private confirmed: JsonObject | null = null;
  private _version = 0;
  private local: JsonObject | null = null;
  private pending: PendingBatch[] = [];
  /** pending[0] while it is on the wire; `uncertain` after the connection dropped under it */
  private inflight: { batch: PendingBatch; uncertain: boolean } | null = null;
  /** server batches that arrived ahead of a missing version */
  private ahead = new Map<number, { ops: SheetOp[]; batchId: string | null }>();
  private seq = 0;
  private joining = false;
  private gapTimer: ReturnType<typeof setTimeout> | null = null;
  private retryTimer: ReturnType<typeof setTimeout> | null = null;
  private presenceTimer: ReturnType<typeof setTimeout> | null = null;
  private presenceOut: { cursor?: Point | null; selection?: SelectionIds } | null = null;
  private idleWaiters: (() => void)[] = [];
  private unlisten: (() => void) | null = null;
  private firstJoin: { resolve: () => void; reject: (err: Error) => void } | null = null;

  constructor(options: SyncClientOptions) {
    this.projectId = options.projectId;
    this.transport = options.transport;
    this.validate = options.validate ?? (() => true);
    this.clientId = options.clientId ?? randomId();
    this.gapTimeoutMs = options.gapTimeoutMs ?? 2000;
    this.presenceIntervalMs = options.presenceIntervalMs ?? 50;
    this.presenceBook = new PresenceBook(() => this.emit('peers', this.presenceBook.list()), options.peerFadeMs);
  }

  get status(): SyncStatus {
    return this._status;
  }
  get role(): Role {
    return this._role;
  }
  /** the server version `confirmed` is at */
  get version(): number {
    return this._version;
  }
  /** what this user sees: the server's document with the pending edits applied */
  get document(): JsonObject | null {
    return this.local;
  }
  /** the server's document at `version` */
  get confirmedDocument(): JsonObject | null {
    return this.confirmed;
  }
  get pendingCount(): number {
    return this.pending.length;
  }
  get peers(): KnownPeer[] {
    return this.presenceBook.list();
  }

  on<K extends keyof SyncClientEvents>(event: K, listener: SyncClientEvents[K]): () => void {
    (this.listeners[event] as Set<SyncClientEvents[K]>).add(listener);
    return () => (this.listeners[event] as Set<SyncClientEvents[K]>).delete(listener);
  }

  private emit<K extends keyof SyncClientEvents>(event: K, ...args: Parameters<SyncClientEvents[K]>): void {
    for (const l of [...(this.listeners[event] as Set<(...a: Parameters<SyncClientEvents[K]>) => void>)]) l(...args);
  }

  private setStatus(s: SyncStatus): void {
    if (this._status === s) return;
    this._status = s;
    this.emit('status', s);
  }

  /** Join the sheet; resolves once the first document is in (or rejects with the refusal). */
  async start(): Promise<void> {
    this.unlisten = this.transport.listen({
      op: (m) => m.projectId === this.projectId && this.onBroadcast(m),
      presence: (m) => m.projectId === this.projectId && this.presenceBook.update(m),
      presenceLeave: (m) => m.projectId === this.projectId && this.presenceBook.leave(m),
      role: (m) => m.projectId === this.projectId && this.setRole(m.role, true),
      closed: (m) => m.projectId === this.projectId && this.close(m.message),
      sessionEnded: () => this.close('You were signed out, so the sheet is closed. Sign in again to keep editing.'),
      up: () => void this.rejoin(),
      down: () => this.onDown(),
    });
    const loaded = new Promise<void>((resolve, reject) => {
      this.firstJoin = { resolve, reject };
    });
    void this.rejoin();
    return loaded;
  }

  /** Leave the sheet and stop listening (the transport stays open for others). */
  stop(): void {
    this.unlisten?.();
    this.unlisten = null;
    for (const t of [this.gapTimer, this.retryTimer, this.presenceTimer]) if (t) clearTimeout(t);
    if (this._status !== 'closed' && this.transport.connected) this.transport.leave(this.projectId);
    this.presenceBook.clear();
    this.setStatus('closed');
    this.firstJoin?.reject(new Error('The sheet was closed before it loaded.'));
    this.firstJoin = null;
    this.wakeIdle();
  }

  /**
   * Queue this user's change (already shown locally by the caller) and send it. Returns false when
   * it cannot be kept: a viewer, a closed sheet, or operations that do not apply to `document`.
   */
  push(ops: SheetOp[]): boolean {
    if (!ops.length) return true;
    if (!this.local || this._status === 'closed' || this._role === 'viewer') return false;
    const r = applyOps(this.local, ops);
    if (!r.ok) {
      this.emit('document', this.local, 'rebase');
      return false;
    }
    this.local = r.doc;
    this.pending.push({ batchId: `${this.clientId}-${++this.seq}`, ops });
    this.flush();
    return true;
  }

  /** Tell the others where this user's cursor is and what is selected (sent at most every presenceIntervalMs). */
  updatePresence(update: { cursor?: Point | null; selection?: SelectionIds }): void {
    if (this._status === 'closed') return;
    this.presenceOut = { ...this.presenceOut, ...update };
    if (this.presenceTimer) return;
    this.presenceTimer = setTimeout(() => {
      this.presenceTimer = null;
      const out = this.presenceOut;
      this.presenceOut = null;
      if (out && this._status === 'live') this.transport.sendPresence({ projectId: this.projectId, ...out });
    }, this.presenceIntervalMs);
  }

  /** Resolves when nothing is pending, in flight or waiting for a missing version (tests, "saved" indicators). */
  whenIdle(): Promise<void> {
    if (this.isIdle()) return Promise.resolve();
    return new Promise((resolve) => this.idleWaiters.push(resolve));
  }

  private isIdle(): boolean {
    return this._status === 'closed' || (this._status === 'live' && !this.pending.length && !this.inflight && !this.ahead.size && !this.joining);
  }

  private wakeIdle(): void {
    if (!this.isIdle()) return;
    const w = this.idleWaiters;
    this.idleWaiters = [];
    for (const f of w) f();
  }

  private setRole(role: Role, announce: boolean): void {
    if (role === this._role) return;
    this._role = role;
    if (role === 'viewer' && this.pending.length) {
      this.emit('notice', { kind: 'dropped', message: `Your role is now viewer, so ${this.pending.length} unsent change(s) were discarded.` });
      this.pending = this.inflight ? [this.inflight.batch] : [];
      this.rebuild('rebase');
    }
    if (announce) this.emit('notice', { kind: 'role', message: role === 'viewer' ? 'Your role on this project is now viewer: you can look and solve, not edit.' : `Your role on this project is now ${role}.` });
    this.emit('role', role);
  }

  private close(message: string): void {
    if (this._status === 'closed') return;
    this.pending = [];
    this.inflight = null;
    this.presenceBook.clear();
    this.setStatus('closed');
    this.emit('notice', { kind: 'closed', message });
    this.wakeIdle();
  }

  private onDown(): void {
    if (this._status === 'closed') return;
    if (this.inflight) this.inflight.uncertain = true;
    this.presenceBook.leaveAll();
    if (this.confirmed) this.setStatus('offline');
  }

  /** Join (again): take the server's document, drop what it already has of ours, re-apply the rest. */
  private async rejoin(): Promise<Refusal | null> {
    if (this.joining || this._status === 'closed' || !this.transport.connected) return null;
    this.joining = true;
    const asked = this.inflight ? [this.inflight.batch.batchId] : [];
    let ack;
    try {
      ack = await this.transport.join({
        projectId: this.projectId,
        ...(this.confirmed ? { sinceVersion: this._version } : {}),
        ...(asked.length ? { pendingBatchIds: asked } : {}),
      });
    } catch {
      this.joining = false;
      return null; // no answer: the transport's next `up` tries again
    } finally {
      this.joining = false;
    }
    if (!ack.ok) {
      if (ack.error.code === 'unavailable') {
        this.retryTimer = setTimeout(() => {
          this.retryTimer = null;
          void this.rejoin();
        }, 1000);
        return ack.error;
      }
      this.close(ack.error.message);
      this.firstJoin?.reject(Object.assign(new Error(ack.error.message), { refusal: ack.error }));
      this.firstJoin = null;
      return ack.error;
    }
    const committed = new Set([...(ack.committed ?? []).map((c) => c.batchId), ...(ack.missed ?? []).map((m) => m.batchId)]);
    if (this.inflight && (committed.has(this.inflight.batch.batchId) || this.inflight.uncertain)) {
      // Committed: it is in the sheet we just got. Uncertain and not committed: send it again
      // (the server commits a batch id once, so a late duplicate is harmless).
      if (committed.has(this.inflight.batch.batchId)) this.pending.shift();
      this.inflight = null;
    }
    this.pending = this.pending.filter((b, i) => (i === 0 && this.inflight) || !committed.has(b.batchId));
    this.confirmed = normalizeForSync(ack.sheet);
    this._version = ack.version;
    for (const v of [...this.ahead.keys()]) if (v <= ack.version) this.ahead.delete(v);
    this.setRole(ack.role, false);
    if (ack.role === 'viewer') this.pending = this.inflight ? [this.inflight.batch] : [];
    this.presenceBook.reset(ack.peers);
    this.setStatus('live');
    const first = this.local === null;
    this.rebuild(first ? 'load' : 'rebase');
    this.drain();
    this.flush();
    this.firstJoin?.resolve();
    this.firstJoin = null;
    this.wakeIdle();
    return null;
  }

  /** local = confirmed + pending; pending batches that no longer apply are dropped, with a notice. */
  private rebuild(cause: DocumentCause, validate = cause !== 'remote'): void {
    if (!this.confirmed) return;
    let doc = this.confirmed;
    const kept: PendingBatch[] = [];
    for (const b of this.pending) {
      const r = applyOps(doc, b.ops);
      if (r.ok && (!validate || this.validate(r.doc))) {
        doc = r.doc;
        kept.push(b);
      } else if (this.inflight?.batch === b) {
        kept.push(b); // cannot be unsent; its answer settles it
      } else {
        this.emit('notice', { kind: 'dropped', message: `One of your changes was discarded: ${r.ok ? 'it no longer makes a valid sheet' : r.error.message}` });
      }
    }
    this.pending = kept;
    this.local = doc;
    this.emit('document', doc, cause);
  }

  private flush(): void {
    if (this.inflight || this.joining || this._status !== 'live' || !this.pending.length) return;
    if (this._role === 'viewer') return;
    this.coalesceHead();
    const batch = this.pending[0];
    this.inflight = { batch, uncertain: false };
    const sent = this.inflight;
    this.transport
      .sendOps({ projectId: this.projectId, baseVersion: this._version, batchId: batch.batchId, ops: batch.ops })
      .then(
        (ack) => this.onAck(sent, ack),
        () => {
          // No answer (dropped connection, timeout): whether it was committed is settled by the rejoin.
          if (this.inflight === sent) sent.uncertain = true;
          if (this.transport.connected) void this.rejoin();
        },
      );
  }

  /** Send queued batches as one message when several are waiting (a drag while the network is slow). */
  private coalesceHead(): void {
    if (this.pending.length < 2 || this.pending[0].solo) return;
    let n = 0;
    let ops = 0;
    while (n < this.pending.length && n < MAX_COALESCE && !this.pending[n].solo && ops + this.pending[n].ops.length <= MAX_OPS_PER_BATCH) {
      ops += this.pending[n].ops.length;
      n++;
    }
    if (n < 2) return;
    const parts = this.pending.slice(0, n).flatMap((b) => b.parts ?? [b]);
    this.pending.splice(0, n, { batchId: `${this.clientId}-${++this.seq}`, ops: parts.flatMap((b) => b.ops), parts });
  }

  private onAck(sent: { batch: PendingBatch; uncertain: boolean }, ack: OpAck): void {
    if (this.inflight !== sent) {
      // Settled by a rejoin meanwhile; an accepted answer still tells us a version's content.
      if (ack.ok && ack.version > this._version) this.ahead.set(ack.version, { ops: sent.batch.ops, batchId: sent.batch.batchId });
      this.drain();
      return;
    }
    this.inflight = null;
    const batch = sent.batch;
    if (ack.ok) {
      this.pending.shift();
      if (ack.version > this._version) this.ahead.set(ack.version, { ops: batch.ops, batchId: batch.batchId });
      this.drain();
      this.flush();
      this.wakeIdle();
      return;
    }
    this.onRefused(batch, ack.error);
  }

  private onRefused(batch: PendingBatch, error: Refusal): void {
    switch (error.code) {
      case 'conflict':
      case 'invalid_sheet':
      case 'invalid_request':
        this.pending.shift();
        if (batch.parts) this.pending.unshift(...batch.parts.map((p) => ({ ...p, solo: true })));
        else this.emit('notice', { kind: 'refused', message: `Your change was not applied: ${error.message}` });
        this.rebuild('rebase');
        break;
      case 'forbidden':
        this.pending = [];
        this.emit('notice', { kind: 'refused', message: error.message });
        this.setRole('viewer', false);
        this.rebuild('rebase');
        break;
      case 'stale':
      case 'not_joined':
        void this.rejoin();
        return;
      case 'unavailable':
        this.retryTimer = setTimeout(() => {
          this.retryTimer = null;
          this.flush();
        }, 1000);
        return;
      case 'not_found':
      case 'signed_out':
        this.close(error.message);
        return;
    }
    this.flush();
    this.wakeIdle();
  }

  private onBroadcast(m: OpBroadcast): void {
    if (!this.confirmed || m.version <= this._version) return;
    this.ahead.set(m.version, { ops: m.ops, batchId: m.batchId });
    this.drain();
  }

  /** Apply server batches in version order; a gap that does not fill in time means a join. */
  private drain(): void {
    if (!this.confirmed || this.joining) return;
    let foreign = false;
    let applied = false;
    for (let next = this.ahead.get(this._version + 1); next; next = this.ahead.get(this._version + 1)) {
      this.ahead.delete(this._version + 1);
      const r: ApplyResult<JsonObject> = applyOps(this.confirmed as JsonObject, next.ops);
      if (!r.ok) {
        // Our copy differs from the server's: start again from its document.
        this.ahead.clear();
        void this.rejoin();
        return;
      }
      this.confirmed = r.doc;
      this._version += 1;
      applied = true;
      // Our own batch coming back (its answer, or after a reconnect the broadcast of a batch the
      // old connection committed): it leaves pending, and a late answer to it is ignored.
      const mine = next.batchId === null ? -1 : this.pending.findIndex((b) => b.batchId === next.batchId);
      if (mine < 0) foreign = true;
      else {
        if (this.inflight?.batch === this.pending[mine]) this.inflight = null;
        this.pending.splice(mine, 1);
        if (mine > 0) foreign = true;
      }
    }
    if (applied && foreign) this.rebuild('remote');
    if (this.gapTimer) clearTimeout(this.gapTimer);
    this.gapTimer = null;
    if (this.ahead.size) {
      this.gapTimer = setTimeout(() => {
        this.gapTimer = null;
        if (this.ahead.size) void this.rejoin();
      }, this.gapTimeoutMs);
    }
    this.wakeIdle();
  }
}

