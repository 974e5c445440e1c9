/**
 * A per-socket message budget: `burst` messages at once, refilled at `perSecond`. Time is
 * passed in so tests need no clock.
 */
export class TokenBucket {
  private tokens: number;
  private last: number;

  constructor(
    private readonly perSecond: number,
    private readonly burst: number,
    now: number = Date.now(),
  ) {
    this.tokens = burst;
    this.last = now;
  }

  /** Takes one token; false when the budget is spent. */
  take(now: number = Date.now()): boolean {
    this.tokens = Math.min(this.burst, this.tokens + ((now - this.last) / 1000) * this.perSecond);
    this.last = now;
    if (this.tokens < 1) return false;
    this.tokens -= 1;
    return true;
  }
}
