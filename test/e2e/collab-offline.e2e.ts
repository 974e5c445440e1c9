/// <reference lib="dom" />

import { Client } from 'pg';
import type { BrowserContext, Page, WebSocketRoute } from 'playwright-core';
import * as Y from 'yjs';

import { readEntry } from '@rampart/collab/doc/doc-to-plan';
import { PLAN_NAMESPACE } from '@rampart/collab/sync/events';

import {
  DEMO_PASSWORD,
  demoPlanId,
  openAs,
  valueInput,
  type Person,
} from '../utils/live-plan-browser';
import { startTestServer, type TestServer } from '../utils/test-server';
import { shoot } from '../utils/screenshots';

/**
 * Cuts one browser's link to the relay while its pages still load: the app has no service
 * worker, so a reload with the whole network off would show the browser's error page. Every
 * socket.io WebSocket runs through a playwright route (closed on `cut()`, refused while cut) and
 * every socket.io polling request is aborted while cut. Page, scripts and `/api` stay reachable.
 */
class RelayLink {
  private _cut = false;
  /** Open relay connections: the page side and the server side of each. */
  private readonly _open = new Set<{ page: WebSocketRoute; server: WebSocketRoute }>();

  static async install(context: BrowserContext): Promise<RelayLink> {
    const link = new RelayLink();
    await context.routeWebSocket(/\/socket\.io\//, (ws) => {
      if (link._cut) return void ws.close();
      const pair = { page: ws, server: ws.connectToServer() };
      link._open.add(pair);
      // A close handler turns off playwright's forwarding of closes: forward them here.
      // Codes are not forwarded: a page's WebSocket may only close with 1000 or 3000-4999.
      ws.onClose(() => {
        link._open.delete(pair);
        void pair.server.close();
      });
      pair.server.onClose(() => {
        link._open.delete(pair);
        void ws.close();
      });
    });
    await context.route(/\/socket\.io\//, (route) =>
      link._cut ? route.abort('internetdisconnected') : route.continue(),
    );
    return link;
  }

  /** Drops every open relay connection and refuses new ones. */
  async cut(): Promise<void> {
    this._cut = true;
    const open = [...this._open];
    this._open.clear();
    await Promise.all(open.flatMap((p) => [p.page.close(), p.server.close()]));
  }

  restore(): void {
    this._cut = false;
  }
}

/** A demo user whose relay link the test can cut. */
interface OfflinePerson extends Person {
  relay?: RelayLink;
}

/** `openAs` with the person's relay connections routed through a `RelayLink`. */
function openCuttable(server: TestServer, person: OfflinePerson, planId: string): Promise<Page> {
  return openAs(server, person, planId, {
    prepare: async (context) => {
      person.relay = await RelayLink.install(context);
    },
    // While cut, Chromium logs each refused relay request; those are the test's own doing.
    ignoreConsole: /socket\.io|ERR_INTERNET_DISCONNECTED/,
  });
}

/** Waits until the R4 value field of `page` reads `text`. */
async function r4Reads(page: Page, text: string): Promise<void> {
  await page.waitForFunction(
    (want) =>
      (document.querySelector('tr[data-part="R4"] input[data-field="value"]') as HTMLInputElement)
        ?.value === want,
    text,
    { timeout: 30_000 },
  );
}

/** Waits until no CSS animation or transition runs (menus and dialogs fade), for screenshots. */
const settled = (page: Page) =>
  page.waitForFunction(() => document.getAnimations().every((a) => a.playState !== 'running'));

/** Names of this page's IndexedDB databases. */
const databaseNames = (page: Page) =>
  page.evaluate(async () => (await indexedDB.databases()).map((d) => d.name ?? ''));

/** The unsent-edit count the client keeps with an offline copy (0 when none stored). */
const storedUnsent = (page: Page, name: string) =>
  page.evaluate(
    (db) =>
      new Promise<number>((resolve) => {
        const open = indexedDB.open(db);
        open.onerror = () => resolve(0);
        open.onsuccess = () => {
          const get = open.result
            .transaction('custom', 'readonly')
            .objectStore('custom')
            .get('unsentEdits');
          get.onsuccess = () => {
            open.result.close();
            resolve(typeof get.result === 'number' ? get.result : 0);
          };
        };
      }),
    name,
  );

/** Live-plan sockets the server holds for `userId`. */
async function relaySockets(server: TestServer, userId: string): Promise<number> {
  const sockets = await server.io.of(PLAN_NAMESPACE).fetchSockets();
  return sockets.filter((s) => (s.data as { userId?: string }).userId === userId).length;
}

/** Polls `check` until it holds; fails naming `what` after 15 s. */
async function until(check: () => Promise<boolean>, what: string): Promise<void> {
  const deadline = Date.now() + 15_000;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`still waiting for: ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** R4's value in the document the server stored in PostgreSQL (compacted state + later log). */
async function storedR4(server: TestServer, planId: string): Promise<number> {
  const db = new Client({ connectionString: server.database.url });
  await db.connect();
  try {
    const doc = new Y.Doc();
    const head = await db.query<{ state: Buffer }>(
      'SELECT "state" FROM "plan_doc_states" WHERE "plan_id" = $1',
      [planId],
    );
    const state = head.rows[0]?.state;
    if (state && state.byteLength > 0) Y.applyUpdate(doc, new Uint8Array(state));
    const log = await db.query<{ update: Buffer }>(
      'SELECT "update" FROM "plan_doc_updates" WHERE "plan_id" = $1 ORDER BY "seq"',
      [planId],
    );
    for (const row of log.rows) Y.applyUpdate(doc, new Uint8Array(row.update));
    return (readEntry(doc, 'parts', 'R4') as { value: number }).value;
  } finally {
    await db.end();
  }
}

describe('live plan offline: kept across a reload, merged when back, cleared at sign-out', () => {
  let server: TestServer;
  let planId: string;
  const owner: OfflinePerson = {
    email: 'olivia.owner@rampart.test',
    name: 'Olivia Owner',
    errors: [],
  };
  const editor: OfflinePerson = {
    email: 'eddie.editor@rampart.test',
    name: 'Eddie Editor',
    errors: [],
  };
  const copyName = () => `rampart-plan:${editor.id}:${planId}`;

  beforeAll(async () => {
    server = await startTestServer({ SEED_DEMO: 'true' });
    planId = await demoPlanId(server, owner.email);
  }, 60_000);

  afterAll(async () => {
    for (const p of [owner, editor]) await p.browser?.close();
    await server?.stop();
  });

  test('edit while cut off → unsent, survives a reload, merged on reconnect for everyone', async () => {
    const a = await openCuttable(server, owner, planId);
    const b = await openCuttable(server, editor, planId);
    for (const page of [a, b]) {
      await page.getByTestId('connection-state').getByText('Live').waitFor({ timeout: 15_000 });
    }
    await a.getByTestId('presence').getByLabel(editor.name).waitFor();
    await expect(valueInput(b, 'R4').inputValue()).resolves.toBe('100 k');
    await b.getByTestId('all-saved').waitFor();

    // Offline: the editor's socket really drops: its chip says so, the server no longer holds a
    // socket of the editor, and the owner's page loses the editor's avatar.
    expect(await relaySockets(server, editor.id!)).toBe(1);
    await editor.relay!.cut();
    await b.getByTestId('connection-state').getByText('Offline').waitFor({ timeout: 15_000 });
    await until(async () => (await relaySockets(server, editor.id!)) === 0, 'editor socket gone');
    await a.getByTestId('presence').getByLabel(editor.name).waitFor({ state: 'detached' });

    await valueInput(b, 'R4').fill('150k');
    await valueInput(b, 'R4').press('Tab');
    await b.getByTestId('unsent-edits').waitFor();
    expect(await b.getByTestId('all-saved').count()).toBe(0);
    // The edit and its unsent count are in the offline copy before the reload.
    await until(async () => (await storedUnsent(b, copyName())) === 1, 'unsent count stored');
    await shoot(b, 'plan-offline-unsent', { lightOnly: true });

    // Reload while still cut off: the plan comes from IndexedDB, edit and indicator included.
    await b.reload();
    await r4Reads(b, '150 k');
    await b.getByTestId('unsent-edits').waitFor();
    await b.getByTestId('connection-state').getByText('Offline').waitFor({ timeout: 15_000 });
    expect(await storedR4(server, planId)).toBe(100_000);
    await expect(valueInput(a, 'R4').inputValue()).resolves.toBe('100 k');
    await shoot(b, 'plan-offline-reloaded', { lightOnly: true });

    // Back online: merged, indicator cleared, the owner and the server's stored doc have it.
    editor.relay!.restore();
    await b.getByTestId('connection-state').getByText('Live').waitFor({ timeout: 30_000 });
    await b.getByTestId('all-saved').waitFor({ timeout: 15_000 });
    expect(await b.getByTestId('unsent-edits').count()).toBe(0);
    await r4Reads(a, '150 k');
    expect(await storedR4(server, planId)).toBe(150_000);
    expect(await storedUnsent(b, copyName())).toBe(0);
    expect(owner.errors).toEqual([]);
    expect(editor.errors).toEqual([]);
  }, 120_000);

  test('sign out with an unsent edit → asks; Cancel keeps it; Sign out anyway leaves no copy', async () => {
    const b = editor.page!;
    expect(await databaseNames(b)).toContain(copyName());

    await editor.relay!.cut();
    await b.getByTestId('connection-state').getByText('Offline').waitFor({ timeout: 15_000 });
    await valueInput(b, 'R4').fill('180k');
    await valueInput(b, 'R4').press('Tab');
    await b.getByTestId('unsent-edits').waitFor();

    const signOut = async () => {
      await b.getByTestId('user-menu').click();
      await b.getByRole('menuitem', { name: 'Sign out' }).click();
      return b.getByRole('dialog');
    };
    let dialog = await signOut();
    await dialog.getByText('Discard unsent edits?').waitFor();
    await dialog.getByText(/^1 edit made in this browser has not reached the server yet/).waitFor();
    await b.getByRole('menu').waitFor({ state: 'detached' });
    await shoot(b, 'sign-out-unsent', { fullPage: false, settle: () => settled(b) });

    // Cancel: still signed in on the plan, the edit and its copy untouched.
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'detached' });
    expect(new URL(b.url()).pathname).toBe(`/plans/${planId}`);
    await b.getByTestId('unsent-edits').waitFor();
    await expect(valueInput(b, 'R4').inputValue()).resolves.toBe('180 k');
    expect(await databaseNames(b)).toContain(copyName());

    // Sign out anyway: every copy of this user is gone from the browser.
    dialog = await signOut();
    await dialog.getByRole('button', { name: 'Sign out anyway' }).click();
    await b.waitForURL(/\/sign-in/);
    const prefix = `rampart-plan:${editor.id}:`;
    expect((await databaseNames(b)).filter((n) => n.startsWith(prefix))).toEqual([]);

    // Signing in again as the same user finds no stale copy, and the discarded edit never
    // comes back: the plan opens with the server's value.
    editor.relay!.restore();
    await b.getByLabel('E-mail').fill(editor.email);
    await b.getByLabel('Password').fill(DEMO_PASSWORD);
    await b.getByRole('button', { name: 'Sign in' }).click();
    await b.getByTestId('user-menu').waitFor();
    expect((await databaseNames(b)).filter((n) => n.startsWith(prefix))).toEqual([]);
    await b.goto(`${server.url}/plans/${planId}`);
    await b.getByTestId('connection-state').getByText('Live').waitFor({ timeout: 30_000 });
    await r4Reads(b, '150 k');
    await b.getByTestId('all-saved').waitFor();
    expect(await storedR4(server, planId)).toBe(150_000);
    await expect(valueInput(owner.page!, 'R4').inputValue()).resolves.toBe('150 k');
    // A fresh copy is made for the new session.
    expect(await databaseNames(b)).toContain(copyName());
    expect(editor.errors).toEqual([]);
  }, 120_000);
});
