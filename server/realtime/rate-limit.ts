// A token bucket per socket: one editor cannot flood the project's queue (each batch is a
// database write). A normal client sends at most one batch per round trip and coalesces the rest,
// so it stays far below this.

/** Batches per second a socket may keep sending. */
export const OPS_PER_SECOND = 100;
/** Batches it may send at once after a quiet spell. */
export const OPS_BURST = 300;

export class TokenBucket {
  private tokens: number;
  private at = Date.now();

  constructor(
    private readonly perSecond = OPS_PER_SECOND,
    private readonly burst = OPS_BURST,
  ) {
    this.tokens = burst;
  }

  /** Take one token; false when the bucket is empty. */
  take(): boolean {
    const now = Date.now();
    this.tokens = Math.min(this.burst, this.tokens + ((now - this.at) / 1000) * this.perSecond);
    this.at = now;
    if (this.tokens < 1) return false;
    this.tokens -= 1;
    return true;
  }
}
