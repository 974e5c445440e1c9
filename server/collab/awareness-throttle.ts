/**
 * Forwards at most `perSecond` presence updates per socket and plan; updates that come faster
 * are coalesced into the latest one (an awareness update carries the whole state, so the latest
 * is all that matters). Presence traffic otherwise costs more than edits.
 */
export class AwarenessThrottle {
  private readonly lastSent = new Map<string, number>();
  private readonly waiting = new Map<
    string,
    { update: Uint8Array; timer: ReturnType<typeof setTimeout> }
  >();
  private readonly intervalMs: number;

  constructor(
    perSecond: number,
    private readonly forward: (planId: string, update: Uint8Array) => void,
  ) {
    this.intervalMs = 1000 / perSecond;
  }

  /** Forwards now, or later as part of the coalesced latest update. */
  submit(planId: string, update: Uint8Array, now: number = Date.now()): void {
    const pending = this.waiting.get(planId);
    if (pending) {
      pending.update = update;
      return;
    }
    const wait = (this.lastSent.get(planId) ?? -Infinity) + this.intervalMs - now;
    if (wait <= 0) {
      this.send(planId, update, now);
      return;
    }
    const entry = {
      update,
      timer: setTimeout(() => {
        this.waiting.delete(planId);
        this.send(planId, entry.update, Date.now());
      }, wait),
    };
    this.waiting.set(planId, entry);
  }

  /** Drops what waits for `planId` (the socket left it), or for every plan. */
  cancel(planId?: string): void {
    for (const [id, entry] of this.waiting) {
      if (planId === undefined || id === planId) {
        clearTimeout(entry.timer);
        this.waiting.delete(id);
      }
    }
  }

  private send(planId: string, update: Uint8Array, now: number): void {
    this.lastSent.set(planId, now);
    this.forward(planId, update);
  }
}
