import { Injectable } from '@angular/core';
import { IndexeddbPersistence } from 'y-indexeddb';
import type * as Y from 'yjs';

/** A browser-local copy of a plan doc that survives reloads and offline periods. */
export interface OfflineCopy {
  /** Resolves once the stored copy has been merged into the doc (or at once when none). */
  readonly loaded: Promise<void>;
  destroy(): void;
}

/**
 * Keeps each plan doc in IndexedDB (y-indexeddb), per user and plan, so edits made offline
 * survive a reload and merge when the relay is back. Where IndexedDB is missing (private modes,
 * jsdom) the doc simply lives in memory.
 */
@Injectable({ providedIn: 'root' })
export class OfflineCopies {
  /** Attaches the offline copy of `planId` for `userId` to `doc`. */
  attach(userId: string, planId: string, doc: Y.Doc): OfflineCopy {
    if (typeof indexedDB === 'undefined') return { loaded: Promise.resolve(), destroy: () => {} };
    const store = new IndexeddbPersistence(`rampart-plan:${userId}:${planId}`, doc);
    // A broken IndexedDB must not block the live session: give up waiting after 3 s.
    const loaded = Promise.race([
      store.whenSynced.then(() => undefined),
      new Promise<void>((resolve) => setTimeout(resolve, 3000)),
    ]);
    return { loaded, destroy: () => void store.destroy() };
  }
}
