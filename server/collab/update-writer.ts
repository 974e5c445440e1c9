import type { Logger } from '../logger';
import type { PendingUpdate } from '../data-access/repositories/plan-document-repository';

/** What the writer needs from storage. */
export interface AppendUpdates {
  (items: readonly PendingUpdate[]): Promise<number[]>;
}

/** An update to store, with the socket that sent it (not echoed back to it). */
export interface WriteItem extends PendingUpdate {
  socketId?: string;
}

/** A stored update and its sequence number. */
export interface StoredItem extends WriteItem {
  seq: number;
}

interface Queued extends WriteItem {
  resolve(seq: number): void;
}

/** Retry schedule and batch size of an `UpdateWriter`. */
export interface WriterTiming {
  writeRetryMs: number;
  writeRetryMaxMs: number;
  writeBatchMax: number;
}

/**
 * Stores one room's updates in order, grouping the updates that arrive while a transaction is
 * in flight into the next one (group commit: one COMMIT for many editors). A failed write is
 * retried with backoff, never dropped; `idle()` resolves only when everything queued is stored,
 * which is what keeps a room in memory until its edits are safe.
 */
export class UpdateWriter {
  private readonly queue: Queued[] = [];
  private flushing: Promise<void> | null = null;
  private stopped = false;
  /** Consecutive failed attempts of the current batch (0 when healthy). */
  failures = 0;

  constructor(
    private readonly label: string,
    private readonly append: AppendUpdates,
    private readonly timing: WriterTiming,
    private readonly log: Logger,
    private readonly onStored: (items: readonly StoredItem[]) => void,
  ) {}

  /** Updates accepted but not yet committed. */
  get pending(): number {
    return this.queue.length;
  }

  /** Queues an update; resolves with its sequence number after COMMIT. */
  enqueue(item: WriteItem): Promise<number> {
    return new Promise<number>((resolve) => {
      this.queue.push({ ...item, resolve });
      this.flushing ??= this.flushLoop();
    });
  }

  /** Resolves once nothing is queued or in flight. */
  async idle(): Promise<void> {
    while (this.flushing) await this.flushing;
  }

  /** Stops retrying (process shutdown); returns how many updates were left unstored. */
  stop(): number {
    this.stopped = true;
    return this.queue.length;
  }

  private async flushLoop(): Promise<void> {
    // Let the updates of the current event-loop turn join the first batch.
    await new Promise<void>((r) => setImmediate(r));
    try {
      while (this.queue.length > 0 && !this.stopped) {
        const batch = this.queue.slice(0, this.timing.writeBatchMax);
        let seqs: number[];
        try {
          seqs = await this.append(batch);
        } catch (err) {
          this.failures++;
          const delay = Math.min(
            this.timing.writeRetryMs * 2 ** (this.failures - 1),
            this.timing.writeRetryMaxMs,
          );
          this.log.error(
            `[collab] ${this.label}: storing ${batch.length} update(s) failed (attempt ${this.failures}), retrying in ${delay} ms`,
            err,
          );
          await new Promise<void>((r) => setTimeout(r, delay));
          continue;
        }
        this.failures = 0;
        this.queue.splice(0, batch.length);
        const stored = batch.map(({ resolve: _r, ...b }, i) => ({ ...b, seq: seqs[i]! }));
        this.onStored(stored);
        batch.forEach((b, i) => b.resolve(seqs[i]!));
      }
    } finally {
      this.flushing = null;
    }
  }
}
