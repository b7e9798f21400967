// Other people on the sheet, as this client knows them: who, where their cursor is, what they
// have selected. A peer who leaves is kept for a moment with `leftAt` set so the view can fade
// them out instead of making them vanish.
import type { Peer, PresenceBroadcast, PresenceLeave } from './protocol';

export interface KnownPeer extends Peer {
  /** ms timestamp (Date.now) of the peer's last update */
  seenAt: number;
  /** set when the peer left; the peer is dropped `fadeMs` later */
  leftAt: number | null;
}

export class PresenceBook {
  private peers = new Map<string, KnownPeer>();
  private timers = new Map<string, ReturnType<typeof setTimeout>>();

  /** @param fadeMs how long a departed peer stays visible (fading), ms */
  constructor(
    private readonly onChange: () => void,
    private readonly fadeMs = 1500,
  ) {}

  /** Everyone currently shown, departed ones (fading) included, in a stable order. */
  list(): KnownPeer[] {
    return [...this.peers.values()].sort((a, b) => a.user.login.localeCompare(b.user.login) || a.clientId.localeCompare(b.clientId));
  }

  /** Replace the whole list (the answer to a join). */
  reset(peers: readonly Peer[]): void {
    for (const t of this.timers.values()) clearTimeout(t);
    this.timers.clear();
    const now = Date.now();
    this.peers = new Map(peers.map((p) => [p.clientId, { ...p, seenAt: now, leftAt: null }]));
    this.onChange();
  }

  update(message: PresenceBroadcast): void {
    const p = message.peer;
    const t = this.timers.get(p.clientId);
    if (t) clearTimeout(t);
    this.timers.delete(p.clientId);
    this.peers.set(p.clientId, { ...p, seenAt: Date.now(), leftAt: null });
    this.onChange();
  }

  leave(message: PresenceLeave): void {
    const p = this.peers.get(message.clientId);
    if (!p || p.leftAt !== null) return;
    this.peers.set(p.clientId, { ...p, leftAt: Date.now() });
    this.timers.set(
      p.clientId,
      setTimeout(() => {
        this.timers.delete(p.clientId);
        this.peers.delete(p.clientId);
        this.onChange();
      }, this.fadeMs),
    );
    this.onChange();
  }

  /** Everyone fades at once (our own connection dropped: we no longer know who is there). */
  leaveAll(): void {
    for (const id of [...this.peers.keys()]) this.leave({ projectId: '', clientId: id });
  }

  clear(): void {
    for (const t of this.timers.values()) clearTimeout(t);
    this.timers.clear();
    this.peers.clear();
    this.onChange();
  }
}
