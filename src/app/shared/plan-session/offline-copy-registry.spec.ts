import { TestBed } from '@angular/core/testing';

import {
  BROWSER_DATABASES,
  OfflineCopyRegistry,
  offlineCopyName,
  type BrowserDatabases,
  type LiveCopy,
} from './offline-copy-registry';

const ANA = 'u-ana';
const BEN = 'u-ben';
const P1 = '11111111-2222-4333-8444-000000000001';
const P2 = '11111111-2222-4333-8444-000000000002';
const P3 = '11111111-2222-4333-8444-000000000003';

/** A request object that settles on the next tick, as IndexedDB's do. */
function request<T>(settle: (r: Record<string, unknown>) => void): T {
  const r: Record<string, unknown> = {};
  setTimeout(() => settle(r));
  return r as T;
}

/**
 * IndexedDB as a map of database name → stored unsent count, with just the calls the registry
 * makes. `blocked` names answer a deletion with `blocked` (another tab holds them open).
 */
class FakeDatabases implements BrowserDatabases {
  readonly stored = new Map<string, number | undefined>();
  readonly deleted: string[] = [];
  readonly blocked = new Set<string>();
  listing = true;

  databases = jest.fn(async () => [...this.stored.keys()].map((name) => ({ name, version: 1 })));

  deleteDatabase = jest.fn((name: string) =>
    request<IDBOpenDBRequest>((r) => {
      this.deleted.push(name);
      if (this.blocked.has(name)) return (r['onblocked'] as () => void)();
      this.stored.delete(name);
      (r['onsuccess'] as () => void)();
    }),
  );

  open = jest.fn((name: string) =>
    request<IDBOpenDBRequest>((r) => {
      const value = this.stored.get(name);
      const get: Record<string, unknown> = { result: value };
      r['result'] = {
        objectStoreNames: { contains: (s: string) => s === 'custom' },
        transaction: () => ({ objectStore: () => ({ get: () => get }) }),
        close: () => undefined,
      };
      (r['onsuccess'] as () => void)();
      setTimeout(() => (get['onsuccess'] as () => void)());
    }),
  );
}

/** A copy open in this tab; `closed` says whether the registry closed it. */
function liveCopy(userId: string, planId: string, unsentEdits: number) {
  const copy = { userId, planId, unsentEdits, closed: false, close: jest.fn() };
  copy.close.mockImplementation(async () => {
    copy.closed = true;
  });
  return copy satisfies LiveCopy;
}

describe('OfflineCopyRegistry', () => {
  let idb: FakeDatabases;
  let registry: OfflineCopyRegistry;

  function setUp(databases: BrowserDatabases | null): void {
    TestBed.configureTestingModule({
      providers: [{ provide: BROWSER_DATABASES, useValue: databases }],
    });
    registry = TestBed.inject(OfflineCopyRegistry);
  }

  beforeEach(() => {
    idb = new FakeDatabases();
    idb.stored.set(offlineCopyName(ANA, P1), 0);
    idb.stored.set(offlineCopyName(ANA, P2), 4);
    idb.stored.set(offlineCopyName(BEN, P1), 7);
    idb.stored.set('some-other-app', 9);
  });

  it('offlineCopyName → rampart-plan:<user>:<plan>', () => {
    expect(offlineCopyName(ANA, P1)).toBe(`rampart-plan:${ANA}:${P1}`);
  });

  it("clearUser(ana) → her open copies closed first, all her copies deleted, no one else's", async () => {
    setUp(idb);
    const open = liveCopy(ANA, P1, 2);
    const bens = liveCopy(BEN, P1, 1);
    registry.register(open);
    registry.register(bens);
    const deleteNow = idb.deleteDatabase.getMockImplementation()!;
    idb.deleteDatabase.mockImplementation((name: string) => {
      // Deleting while a connection is open would be held back: it must be closed by now.
      expect(open.closed).toBe(true);
      return deleteNow(name);
    });

    const names = await registry.clearUser(ANA);

    expect(names).toEqual([offlineCopyName(ANA, P1), offlineCopyName(ANA, P2)]);
    expect(open.close).toHaveBeenCalledTimes(1);
    expect(bens.close).not.toHaveBeenCalled();
    expect([...idb.stored.keys()].sort()).toEqual([offlineCopyName(BEN, P1), 'some-other-app']);
    // A closed copy no longer counts.
    await expect(registry.unsentEdits(ANA)).resolves.toBe(0);
  });

  it('clearUser with a copy held open by another tab → resolves (deletion queued)', async () => {
    setUp(idb);
    idb.blocked.add(offlineCopyName(ANA, P2));
    await expect(registry.clearUser(ANA)).resolves.toEqual([
      offlineCopyName(ANA, P1),
      offlineCopyName(ANA, P2),
    ]);
    expect(idb.deleted.sort()).toEqual([offlineCopyName(ANA, P1), offlineCopyName(ANA, P2)]);
  });

  it('browser without indexedDB.databases() → deletes the copies open in this tab', async () => {
    const partial = idb as Partial<BrowserDatabases>;
    delete partial.databases;
    setUp(partial as BrowserDatabases);
    registry.register(liveCopy(ANA, P3, 0));
    await expect(registry.clearUser(ANA)).resolves.toEqual([offlineCopyName(ANA, P3)]);
    expect(idb.deleted).toEqual([offlineCopyName(ANA, P3)]);
  });

  it('no IndexedDB at all → nothing to count or clear', async () => {
    setUp(null);
    expect(registry.available).toBe(false);
    await expect(registry.unsentEdits(ANA)).resolves.toBe(0);
    await expect(registry.clearUser(ANA)).resolves.toEqual([]);
  });

  it("unsentEdits(ana) → live count of open copies + stored count of others, not Ben's", async () => {
    setUp(idb);
    // P1 is open with 3 unsent (its stored 0 is stale); P2 was left with 4; P3 open with 1.
    registry.register(liveCopy(ANA, P1, 3));
    registry.register(liveCopy(ANA, P3, 1));
    registry.register(liveCopy(BEN, P2, 5));
    await expect(registry.unsentEdits(ANA)).resolves.toBe(3 + 4 + 1);
    expect(idb.open.mock.calls.map(([name]) => name)).toEqual([offlineCopyName(ANA, P2)]);
  });

  it('stored count missing or not a count → 0', async () => {
    setUp(idb);
    idb.stored.set(offlineCopyName(ANA, P2), undefined);
    idb.stored.set(offlineCopyName(ANA, P3), -2);
    await expect(registry.unsentEdits(ANA)).resolves.toBe(0);
  });

  it('register → unregister removes the copy from the count', async () => {
    setUp(idb);
    const unregister = registry.register(liveCopy(ANA, P3, 6));
    await expect(registry.unsentEdits(ANA)).resolves.toBe(6 + 4);
    unregister();
    await expect(registry.unsentEdits(ANA)).resolves.toBe(4);
  });
});
