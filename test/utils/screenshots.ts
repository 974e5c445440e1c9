/**
 * Screenshots of the browser tests, in light and dark theme, saved to `dist/screenshots/` for
 * people to look at when a screen changes (they assert nothing).
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';

import type { Page } from 'playwright-core';

export const SCREENSHOT_DIR = path.resolve(__dirname, '../../dist/screenshots');

export interface ShotOptions {
  /** The whole scrollable page (default) or only the viewport (dialogs over a long page). */
  fullPage?: boolean;
  /** Runs after each theme switch, before its shot (e.g. wait for transitions to end). */
  settle?: () => Promise<unknown>;
  /** Light theme only. */
  lightOnly?: boolean;
}

/** Saves `<name>.png` (light) and `<name>-dark.png`, then leaves the page in the light theme. */
export async function shoot(page: Page, name: string, options: ShotOptions = {}): Promise<void> {
  const { fullPage = true, settle, lightOnly = false } = options;
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  await page.emulateMedia({ colorScheme: 'light' });
  await settle?.();
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage });
  if (lightOnly) return;
  await page.emulateMedia({ colorScheme: 'dark' });
  await settle?.();
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}-dark.png`), fullPage });
  await page.emulateMedia({ colorScheme: 'light' });
}
