import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

import { chromium, type BrowserContext } from 'playwright-core';

/** Debian's Chromium (installed by the test script); playwright never downloads a browser here. */
function chromiumPath(): string {
  try {
    return execFileSync('sh', ['-c', 'command -v chromium'], { encoding: 'utf8' }).trim();
  } catch {
    throw new Error(
      'Chromium not found: run the tests through `npm test` (it installs Debian chromium)',
    );
  }
}

export interface TestBrowser {
  context: BrowserContext;
  close(): Promise<void>;
}

/** A headless Chromium with a fresh profile; flags keep it off the (closed) network. */
export async function launchBrowser(): Promise<TestBrowser> {
  const profile = mkdtempSync(path.join(os.tmpdir(), 'rampart-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: chromiumPath(),
    headless: true,
    viewport: { width: 1280, height: 800 },
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
