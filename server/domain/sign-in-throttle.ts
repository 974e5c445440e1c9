/** Settings of the per-account sign-in delay. */
export interface SignInThrottleOptions {
  /** Failed tries allowed before the waits start. */
  freeFailures: number;
  /** First wait, in ms; each further failure doubles it. */
  baseDelayMs: number;
  /** Longest wait, in ms. */
  maxDelayMs: number;
  /** Clock (tests pass their own). */
  now?: () => number;
}

interface FailureState {
  failures: number;
  lastFailureAt: number;
}

/**
 * Growing delay per account after failed sign-ins, kept in this process's memory (a restart
 * forgets it; the per-address rate limit still applies). After `freeFailures` failures every
 * further try must wait `baseDelayMs · 2^(n − freeFailures − 1)` (capped) after the last
 * failure; tries inside the wait are refused without checking the password, so guessing slows
 * down exponentially. A successful sign-in clears the account's record.
 */
export class SignInThrottle {
  private readonly _state = new Map<string, FailureState>();
  private readonly _now: () => number;

  constructor(private readonly _options: SignInThrottleOptions) {
    this._now = _options.now ?? Date.now;
  }

  /** Milliseconds `account` must still wait before its next try (0 = may try now). */
  waitMs(account: string): number {
    const s = this._state.get(account);
    if (!s) return 0;
    const delay = this.delayAfter(s.failures);
    return Math.max(0, s.lastFailureAt + delay - this._now());
  }

  /** The wait imposed after `failures` consecutive failures. */
  delayAfter(failures: number): number {
    const { freeFailures, baseDelayMs, maxDelayMs } = this._options;
    if (failures <= freeFailures) return 0;
    const doublings = Math.min(failures - freeFailures - 1, 30);
    return Math.min(maxDelayMs, baseDelayMs * 2 ** doublings);
  }

  recordFailure(account: string): void {
    const s = this._state.get(account);
    this._state.set(account, { failures: (s?.failures ?? 0) + 1, lastFailureAt: this._now() });
    // Bound memory: forget the oldest entries when someone sprays many addresses.
    if (this._state.size > 10_000) {
      const oldest = this._state.keys().next().value;
      if (oldest !== undefined) this._state.delete(oldest);
    }
  }

  recordSuccess(account: string): void {
    this._state.delete(account);
  }
}
