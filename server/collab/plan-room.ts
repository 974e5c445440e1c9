import { Awareness } from 'y-protocols/awareness';
import * as Y from 'yjs';

import { PERSISTENCE_ORIGIN } from '@rampart/collab/doc/doc-origin';

import type { StoredDocument } from '../data-access/repositories/plan-document-repository';
import type { UpdateWriter } from './update-writer';

/**
 * Origin of updates the relay applies to a room's doc. `socketId` is the sender (not echoed back
 * to it); absent for updates from another process or from storage.
 */
export interface RelayOrigin {
  readonly kind: 'remote';
  readonly socketId?: string;
  /** True when another server process sent it (never sent on to the other processes again). */
  readonly relayed?: boolean;
}

/** Lifecycle of a room: loading from storage → ready → closing (storing, then unloaded). */
export type RoomPhase = 'loading' | 'ready' | 'closing' | 'closed';

/**
 * One open plan in this process: its Y.Doc and presence, the sockets here that joined it, and
 * which stored sequence numbers its doc already holds.
 */
export class PlanRoom {
  readonly doc = new Y.Doc();
  readonly awareness = new Awareness(this.doc);
  /** Local sockets in the room, with the awareness client ids each one introduced. */
  readonly members = new Map<string, Set<number>>();
  phase: RoomPhase = 'loading';
  /** Every seq up to this one is in `doc`. */
  contiguousSeq = 0;
  /** Seqs above `contiguousSeq` already applied (relayed out of order). */
  private readonly aboveSeqs = new Set<number>();
  /** Log size since this process last compacted, counted from what it loaded and wrote. */
  logCount = 0;
  logBytes = 0;
  /** Compactions, reloads and closes in flight; a room is unloaded only when this is empty. */
  readonly inFlight = new Set<Promise<unknown>>();
  closeTimer: ReturnType<typeof setTimeout> | null = null;
  /** Set once, when the room's doc has been loaded from storage. */
  ready!: Promise<void>;
  closed: Promise<void> | null = null;
  writer!: UpdateWriter;

  constructor(readonly planId: string) {
    // The server shares no presence of its own.
    this.awareness.setLocalState(null);
  }

  /** Applies what storage holds and records its last seq as seen. */
  applyStored(stored: StoredDocument): void {
    Y.transact(
      this.doc,
      () => {
        Y.applyUpdate(this.doc, stored.state, PERSISTENCE_ORIGIN);
        for (const u of stored.updates) Y.applyUpdate(this.doc, u.update, PERSISTENCE_ORIGIN);
      },
      PERSISTENCE_ORIGIN,
    );
    if (stored.lastSeq > this.contiguousSeq) {
      this.contiguousSeq = stored.lastSeq;
      for (const s of this.aboveSeqs) if (s <= this.contiguousSeq) this.aboveSeqs.delete(s);
    }
  }

  /** Applies a stored update (from this process's writer or relayed by another process). */
  applyUpdate(update: Uint8Array, seq: number, origin: RelayOrigin): void {
    Y.applyUpdate(this.doc, update, origin);
    this.markSeen(seq);
  }

  /** Whether storage may hold updates this doc lacks, given the plan's last seq there. */
  isBehind(lastSeq: number): boolean {
    return lastSeq > this.contiguousSeq;
  }

  /** Records that the doc holds stored update `seq`. */
  markSeen(seq: number): void {
    if (seq <= this.contiguousSeq) return;
    this.aboveSeqs.add(seq);
    while (this.aboveSeqs.delete(this.contiguousSeq + 1)) this.contiguousSeq++;
  }

  /** Frees the doc and its awareness timer. */
  destroy(): void {
    if (this.closeTimer) clearTimeout(this.closeTimer);
    this.phase = 'closed';
    this.awareness.destroy();
    this.doc.destroy();
  }
}
