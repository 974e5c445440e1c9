/// <reference lib="dom" />

import { demoPlanId, openAs, valueInput, type Person } from '../utils/live-plan-browser';
import { shoot } from '../utils/screenshots';
import { startTestServer, type TestServer } from '../utils/test-server';

describe('live plan in two browsers and a viewer', () => {
  let server: TestServer;
  let planId: string;
  const owner: Person = { email: 'olivia.owner@rampart.test', name: 'Olivia Owner', errors: [] };
  const editor: Person = { email: 'eddie.editor@rampart.test', name: 'Eddie Editor', errors: [] };
  const viewer: Person = { email: 'vic.viewer@rampart.test', name: 'Vic Viewer', errors: [] };

  beforeAll(async () => {
    server = await startTestServer({ SEED_DEMO: 'true' });
    planId = await demoPlanId(server, owner.email);
  }, 60_000);

  afterAll(async () => {
    for (const p of [owner, editor, viewer]) await p.browser?.close();
    await server?.stop();
  });

  test('two editors → see each other, their edits, cursors and undo; no console errors', async () => {
    const a = await openAs(server, owner, planId);
    const b = await openAs(server, editor, planId);
    for (const page of [a, b]) {
      await page.getByTestId('connection-state').getByText('Live').waitFor({ timeout: 15_000 });
      await page.getByTestId('plan-name').getByText('Motor-drive controller').waitFor();
    }
    // Presence: each sees the other's avatar.
    await a.getByTestId('presence').getByLabel(editor.name).waitFor();
    await b.getByTestId('presence').getByLabel(owner.name, { exact: true }).waitFor();

    // Owner changes R4 with engineering input; the editor sees the stored value.
    await expect(valueInput(b, 'R4', 'value').inputValue()).resolves.toBe('100 k');
    await valueInput(a, 'R4', 'value').fill('120k');
    await valueInput(a, 'R4', 'value').press('Tab');
    await b.waitForFunction(
      () =>
        (document.querySelector('tr[data-part="R4"] input[data-field="value"]') as HTMLInputElement)
          ?.value === '120 k',
    );
    await a.getByTestId('all-saved').waitFor();

    // Editor changes C3's tolerance; the owner sees it.
    await valueInput(b, 'C3', 'tolerance').fill('20');
    await valueInput(b, 'C3', 'tolerance').press('Tab');
    await a.waitForFunction(
      () =>
        (
          document.querySelector(
            'tr[data-part="C3"] input[data-field="tolerance"]',
          ) as HTMLInputElement
        )?.value === '20',
    );

    // A bad entry is refused by name and never leaves the page.
    await valueInput(a, 'R4', 'value').fill('-3');
    await valueInput(a, 'R4', 'value').press('Tab');
    await a
      .getByRole('alert')
      .getByText(/part R4 value/)
      .waitFor();

    // Cursor time: the owner hovers the time axis; the editor sees the owner's cursor.
    const axis = a.getByTestId('time-axis');
    const box = await axis.boundingBox();
    if (!box) throw new Error('time axis not laid out');
    await a.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await b.locator(`[data-cursor-readout]`).getByText(owner.name).waitFor();

    await shoot(a, 'plan-live');

    // Undo on the owner's side reverts only the owner's edit, for everyone.
    await a.getByTestId('undo').click();
    await b.waitForFunction(
      () =>
        (document.querySelector('tr[data-part="R4"] input[data-field="value"]') as HTMLInputElement)
          ?.value === '100 k',
    );
    await expect(valueInput(a, 'C3', 'tolerance').inputValue()).resolves.toBe('20');
    // The offline copy (y-indexeddb) exists for this user and plan, so edits survive a reload.
    const stores = await a.evaluate(async () => (await indexedDB.databases()).map((d) => d.name));
    expect(stores.some((n) => n?.startsWith('rampart-plan:') && n.endsWith(planId))).toBe(true);
    expect(owner.errors).toEqual([]);
    expect(editor.errors).toEqual([]);
  }, 90_000);

  test('viewer → read-only banner, disabled fields, forced edit refused, nothing changes', async () => {
    const c = await openAs(server, viewer, planId);
    await c.getByTestId('connection-state').getByText('read-only').waitFor({ timeout: 15_000 });
    await c
      .getByTestId('read-only-banner')
      .getByText(/viewer/)
      .waitFor();
    expect(await valueInput(c, 'R4', 'value').isDisabled()).toBe(true);
    expect(await c.getByTestId('undo').isDisabled()).toBe(true);
    const before = await valueInput(c, 'RL5', 'value').inputValue();
    // Enable the field by hand, as a curious viewer with dev tools might.
    await c.evaluate(() => {
      const input = document.querySelector(
        'tr[data-part="RL5"] input[data-field="value"]',
      ) as HTMLInputElement;
      input.disabled = false;
      input.value = '47';
      input.dispatchEvent(new Event('change'));
    });
    await c
      .getByTestId('session-error')
      .getByText(/read-only/)
      .waitFor();
    await shoot(c, 'plan-viewer');
    // The editors' pages still show the stored value.
    const a = owner.page!;
    await expect(valueInput(a, 'RL5', 'value').inputValue()).resolves.toBe(before);
    await a.getByTestId('presence').getByLabel(viewer.name).waitFor();
    expect(viewer.errors).toEqual([]);
  }, 60_000);
});
