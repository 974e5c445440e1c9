/// <reference lib="dom" />

import { linkInMail } from '../utils/api-client';
import { launchBrowser, type TestBrowser } from '../utils/browser';
import { shoot } from '../utils/screenshots';
import { startTestServer, type TestServer } from '../utils/test-server';

// A whole user journey in a real browser on a shared 2-core machine: minutes, not seconds.
jest.setTimeout(180_000);

// Demo account seeded by the server (`server/data-access/seed.ts`); local use only.
const EDITOR = 'eddie.editor@rampart.test';
const NEW_PASSWORD = 'bench supply at 24 volts';

describe('accounts in Chromium: password reset by e-mail', () => {
  let server: TestServer;
  let browser: TestBrowser;
  beforeAll(async () => {
    server = await startTestServer({ SEED_DEMO: 'true' });
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  test('forgot password → mailed link → new password → sign in with it; link used twice → refused', async () => {
    const page = await browser.context.newPage();
    await page.goto(`${server.url}/sign-in`);
    await page.getByRole('link', { name: 'Forgot password?' }).click();
    await page.getByLabel('E-mail').fill(EDITOR);
    await page.getByRole('button', { name: 'Send reset link' }).click();
    await page.getByTestId('reset-sent').waitFor();
    await shoot(page, 'forgot-password');

    const link = await linkInMail(server.url, EDITOR, '/reset-password');
    await page.goto(link);
    await page.getByRole('heading', { name: 'Choose a new password' }).waitFor();
    await page.getByLabel('New password', { exact: true }).fill(NEW_PASSWORD);
    await page.getByLabel('Repeat new password').fill(NEW_PASSWORD);
    await page.getByRole('button', { name: 'Save password' }).click();

    await page.getByText('Your password was changed. Sign in with the new one.').waitFor();
    await page.getByLabel('E-mail').fill(EDITOR);
    await page.getByLabel('Password', { exact: true }).fill(NEW_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Your teams' }).waitFor();
    await expect(page.getByTestId('user-menu').textContent()).resolves.toContain('Eddie Editor');

    // The link is single-use: opening it again and saving shows the server's refusal.
    await page.goto(link);
    await page.getByLabel('New password', { exact: true }).fill('another long password');
    await page.getByLabel('Repeat new password').fill('another long password');
    await page.getByRole('button', { name: 'Save password' }).click();
    const refusal = page.getByTestId('form-error');
    await refusal.waitFor();
    expect(await refusal.getByRole('link', { name: 'Ask for a new link' }).count()).toBe(1);
    await shoot(page, 'reset-password-used');
    await page.close();
  });
});
