import { Injectable, inject } from '@angular/core';
import { IndexeddbPersistence } from 'y-indexeddb';
import * as Y from 'yjs';

import { OfflineCopyRegistry, UNSENT_KEY, countOf, offlineCopyName } from './offline-copy-registry';

/** What a stored offline copy held when it was opened. */
export interface StoredCopy {
  /** The copy held a plan: the page can show it before (or without) the relay. */
  hasPlan: boolean;
  /** Edits made here that the server had not acknowledged when the copy was last written. */
  unsentEdits: number;
}

/** A browser-local copy of a plan doc that survives reloads and offline periods. */
export interface OfflineCopy {
  /** Resolves once the stored copy has been merged into the doc (or at once when none). */
  readonly loaded: Promise<StoredCopy>;
  /** Remembers how many edits are unsent, so a reload while offline still shows them. */
  setUnsentEdits(count: number): void;
  /** Stops writing to the copy; the stored data stays (until sign-out). */
  destroy(): void;
}

/** A broken IndexedDB must not block the live session: give up waiting after this. */
const LOAD_TIMEOUT_MS = 3000;

/**
 * Keeps each plan doc in IndexedDB (y-indexeddb), per user and plan, so edits made offline
 * survive a reload and merge when the relay is back. Where IndexedDB is missing (private modes,
 * jsdom) the doc simply lives in memory. Every copy is registered with `OfflineCopyRegistry`,
 * which deletes them all at sign-out.
 */
@Injectable({ providedIn: 'root' })
export class OfflineCopies {
  private readonly _registry = inject(OfflineCopyRegistry);

  /** Attaches the offline copy of `planId` for `userId` to `doc`. */
  attach(userId: string, planId: string, doc: Y.Doc): OfflineCopy {
    if (!this._registry.available) {
      return {
        loaded: Promise.resolve({ hasPlan: false, unsentEdits: 0 }),
        setUnsentEdits: () => undefined,
        destroy: () => undefined,
      };
    }
    const store = new IndexeddbPersistence(offlineCopyName(userId, planId), doc);
    let closed: Promise<void> | null = null;
    let unsentEdits = 0;
    const unregister = this._registry.register({
      userId,
      planId,
      get unsentEdits() {
        return unsentEdits;
      },
      close: () => {
        unregister();
        closed ??= store.destroy();
        return closed;
      },
    });
    const loaded = Promise.race([
      store.whenSynced.then(async (): Promise<StoredCopy> => {
        const stored: unknown = await store.get(UNSENT_KEY).catch(() => 0);
        unsentEdits = countOf(stored);
        // An empty doc's state vector is one byte (zero clients).
        return { hasPlan: Y.encodeStateVector(doc).byteLength > 1, unsentEdits };
      }),
      new Promise<StoredCopy>((resolve) =>
        setTimeout(() => resolve({ hasPlan: false, unsentEdits: 0 }), LOAD_TIMEOUT_MS),
      ),
    ]);
    return {
      loaded,
      setUnsentEdits: (count) => {
        unsentEdits = count;
        if (closed === null) void store.set(UNSENT_KEY, count).catch(() => undefined);
      },
      destroy: () => {
        unregister();
        closed ??= store.destroy();
      },
    };
  }
}
