/// <reference lib="dom" />

import { launchBrowser, type TestBrowser } from '../utils/browser';
import { shoot } from '../utils/screenshots';
import { startTestServer, type TestServer } from '../utils/test-server';

describe('app shell in Chromium', () => {
  let server: TestServer;
  let browser: TestBrowser;
  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  test('home page → toolbar, database reported up, safety caution, no failed requests', async () => {
    const page = await browser.context.newPage();
    const failed: string[] = [];
    const consoleErrors: string[] = [];
    page.on('console', (m) => {
      // Signed out, `GET /api/auth/me` answers 401 by contract; Chromium logs that as a failed load.
      if (m.type() === 'error' && !/401/.test(m.text())) consoleErrors.push(m.text());
    });
    page.on('requestfailed', (r) => {
      // A request the app itself cancels (a poll superseded by the next one) is not a failure.
      if (r.failure()?.errorText !== 'net::ERR_ABORTED')
        failed.push(`${r.failure()?.errorText} ${r.url()}`);
    });
    page.on('response', (r) => {
      const signedOutProbe = r.status() === 401 && new URL(r.url()).pathname === '/api/auth/me';
      if (r.status() >= 400 && !signedOutProbe) failed.push(`${r.status()} ${r.url()}`);
    });
    await page.goto(`${server.url}/`);
    await page.getByText('Rampart', { exact: true }).first().waitFor();
    await page.getByTestId('health-badge').getByText('Database up').waitFor({ timeout: 15_000 });
    await page.getByText('Results are engineering estimates').waitFor();
    // The icon font is applied and loaded (ligatures render as glyphs, not words).
    const iconFont = await page.evaluate(async () => {
      const icon = document.querySelector('mat-icon');
      await document.fonts.load('24px "Material Symbols Outlined"');
      return icon ? getComputedStyle(icon).fontFamily : 'no icon';
    });
    expect(iconFont).toContain('Material Symbols Outlined');
    // The shipped font really renders (no fallback): the browser reports it loaded.
    const fontLoaded = await page.evaluate(async () => {
      await document.fonts.ready;
      return document.fonts.check('16px "Atkinson Hyperlegible"');
    });
    expect(fontLoaded).toBe(true);
    await shoot(page, 'home');
    expect(failed).toEqual([]);
    expect(consoleErrors).toEqual([]);
    await page.close();
  });

  test('deep link /sign-in → served by the SPA fallback and routed client-side', async () => {
    const page = await browser.context.newPage();
    const res = await page.goto(`${server.url}/sign-in`);
    expect(res?.status()).toBe(200);
    await page
      .getByRole('heading', { name: 'Sign in' })
      .or(page.getByText('Sign in', { exact: true }))
      .first()
      .waitFor();
    await page.close();
  });
});
