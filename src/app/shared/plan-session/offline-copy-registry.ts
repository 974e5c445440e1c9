import { Injectable, InjectionToken, inject } from '@angular/core';

/** The part of `IDBFactory` the registry needs; a seam so specs need no real IndexedDB. */
export type BrowserDatabases = Pick<IDBFactory, 'databases' | 'deleteDatabase' | 'open'>;

/** IndexedDB of this page, or null where there is none (private modes, jsdom). */
export const BROWSER_DATABASES = new InjectionToken<BrowserDatabases | null>('BROWSER_DATABASES', {
  providedIn: 'root',
  factory: () => (typeof indexedDB === 'undefined' ? null : indexedDB),
});

const userPrefix = (userId: string) => `rampart-plan:${userId}:`;

/** The database name of one user's offline copy of one plan. */
export function offlineCopyName(userId: string, planId: string): string {
  return `${userPrefix(userId)}${planId}`;
}

/** Key of the unsent-edit count in a copy's `custom` store (y-indexeddb's key/value store). */
export const UNSENT_KEY = 'unsentEdits';

/** An offline copy open in this tab, as the registry sees it. */
export interface LiveCopy {
  readonly userId: string;
  readonly planId: string;
  /** Edits in the copy not yet acknowledged by the server. */
  readonly unsentEdits: number;
  /** Detaches from the doc and closes the database connection (the data stays). */
  close(): Promise<void>;
}

/**
 * Knows the offline copies of this browser: the ones open in this tab (registered by
 * `OfflineCopies`) and, through `indexedDB.databases()`, every stored one. Free of Yjs, so the
 * shell's sign-out can use it without loading the plan code.
 */
@Injectable({ providedIn: 'root' })
export class OfflineCopyRegistry {
  private readonly _databases = inject(BROWSER_DATABASES);
  private readonly _live = new Set<LiveCopy>();

  /** Whether this browser can keep offline copies at all. */
  get available(): boolean {
    return this._databases !== null;
  }

  /** Registers a copy opened in this tab; returns the call that unregisters it. */
  register(copy: LiveCopy): () => void {
    this._live.add(copy);
    return () => this._live.delete(copy);
  }

  /**
   * Unsent edits stored in this browser for `userId`: the live count of copies open in this tab,
   * plus the stored count of the user's other copies (a plan edited offline, then left).
   */
  async unsentEdits(userId: string): Promise<number> {
    const open = this._open(userId);
    let total = open.reduce((sum, c) => sum + c.unsentEdits, 0);
    const openNames = new Set(open.map((c) => offlineCopyName(userId, c.planId)));
    for (const name of await this._userDatabases(userId)) {
      if (!openNames.has(name)) total += await this._storedUnsent(name);
    }
    return total;
  }

  /**
   * Deletes every offline copy of `userId`'s plans from this browser: the copies open in this tab
   * are closed first (an open connection would hold the deletion back), then every database
   * named for the user goes. Resolves with the names deleted.
   */
  async clearUser(userId: string): Promise<string[]> {
    const open = this._open(userId);
    open.forEach((c) => this._live.delete(c));
    await Promise.all(open.map((c) => c.close()));
    const names = new Set(open.map((c) => offlineCopyName(userId, c.planId)));
    for (const name of await this._userDatabases(userId)) names.add(name);
    await Promise.all([...names].map((name) => this._delete(name)));
    return [...names].sort();
  }

  private _open(userId: string): LiveCopy[] {
    return [...this._live].filter((c) => c.userId === userId);
  }

  private async _userDatabases(userId: string): Promise<string[]> {
    // `databases()` is missing in older browsers: then only the copies open here are known.
    if (!this._databases || typeof this._databases.databases !== 'function') return [];
    const prefix = userPrefix(userId);
    const all = await this._databases.databases().catch(() => [] as IDBDatabaseInfo[]);
    return all.map((d) => d.name ?? '').filter((n) => n.startsWith(prefix));
  }

  private _delete(name: string): Promise<void> {
    const databases = this._databases;
    if (!databases) return Promise.resolve();
    return new Promise((resolve) => {
      const request = databases.deleteDatabase(name);
      request.onsuccess = () => resolve();
      request.onerror = () => resolve();
      // Another tab still has it open: the deletion is queued and runs once that tab lets go.
      request.onblocked = () => resolve();
    });
  }

  /** Reads the unsent-edit count of a copy that is not open, without loading its updates. */
  private _storedUnsent(name: string): Promise<number> {
    const databases = this._databases;
    if (!databases) return Promise.resolve(0);
    return new Promise((resolve) => {
      const request = databases.open(name);
      // The name came from `databases()`; never leave an empty database behind by reading.
      request.onupgradeneeded = () => request.transaction?.abort();
      request.onerror = () => resolve(0);
      request.onsuccess = () => {
        const db = request.result;
        const done = (n: number) => {
          db.close();
          resolve(n);
        };
        if (!db.objectStoreNames.contains('custom')) return done(0);
        const get = db.transaction('custom', 'readonly').objectStore('custom').get(UNSENT_KEY);
        get.onsuccess = () => done(countOf(get.result));
        get.onerror = () => done(0);
      };
    });
  }
}

/** A stored count, or 0 for anything else. */
export function countOf(value: unknown): number {
  return typeof value === 'number' && Number.isInteger(value) && value > 0 ? value : 0;
}
