/// <reference lib="dom" />

import type { Page } from 'playwright-core';

import { linkInMail } from '../utils/api-client';
import { launchBrowser, type TestBrowser } from '../utils/browser';
import { shoot } from '../utils/screenshots';
import { startTestServer, type TestServer } from '../utils/test-server';

// A whole user journey in a real browser on a shared 2-core machine: minutes, not seconds.
jest.setTimeout(180_000);

// Demo accounts seeded by the server (`server/data-access/seed.ts`); local use only.
const OWNER = { email: 'olivia.owner@rampart.test', password: 'rampart-demo' };
const NEWCOMER = {
  email: 'nora.newcomer@rampart.test',
  name: 'Nora Newcomer',
  password: 'a long enough passphrase',
};
const OTHER_INVITEE = 'sam.second@rampart.test';
const TEAM = 'Motor-drive controller team';

async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

async function invite(page: Page, email: string): Promise<void> {
  await page.getByLabel('E-mail to invite').fill(email);
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await page.getByTestId('invite-sent').getByText(`Invitation sent to ${email}`).waitFor();
}

describe('accounts in Chromium: invitation by e-mail', () => {
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

  test('owner invites → mail in the fake SMTP → newcomer registers, accepts → sees the team', async () => {
    const page = await browser.context.newPage();
    const failures: string[] = [];
    page.on('response', (r) => {
      // 401 from who-am-I is the normal "signed out" answer.
      if (r.status() >= 400 && !(r.status() === 401 && r.url().endsWith('/api/auth/me'))) {
        failures.push(`${r.status()} ${r.request().method()} ${r.url()}`);
      }
    });

    // Owner signs in and opens the team page.
    await page.goto(`${server.url}/sign-in`);
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('E-mail is required.').waitFor();
    await shoot(page, 'sign-in-errors');
    await signIn(page, OWNER.email, OWNER.password);
    await page.getByRole('heading', { name: 'Your teams' }).waitFor();
    await shoot(page, 'teams');
    await page.getByRole('link', { name: new RegExp(TEAM) }).click();
    await page.getByRole('heading', { name: TEAM }).waitFor();
    await page.getByTestId('members-table').getByText('Vic Viewer').waitFor();

    // Two invitations: one to the newcomer, one to an address nobody will sign in as.
    await invite(page, NEWCOMER.email);
    await invite(page, OTHER_INVITEE);
    await page.getByTestId('pending-invitations').getByText(OTHER_INVITEE).waitFor();
    await shoot(page, 'team-owner');

    // Owner signs out from the user menu.
    await page.getByTestId('user-menu').click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.getByText('You are signed out.').waitFor();

    // The invitation mail reached the fake SMTP server; its link opens the invitation page.
    const link = await linkInMail(server.url, NEWCOMER.email, '/invitations/');
    expect(new URL(link).origin).toBe(server.url.replace(/\/$/, ''));
    await page.goto(link);
    await page.getByTestId('invitation-offer').getByText(TEAM).waitFor();
    await shoot(page, 'invitation-signed-out');

    // Register first (e-mail prefilled from the invitation), then back to the invitation.
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.getByRole('heading', { name: 'Create an account' }).waitFor();
    expect(await page.getByLabel('E-mail').inputValue()).toBe(NEWCOMER.email);
    await page.getByLabel('Name').fill(NEWCOMER.name);
    await page.getByLabel('Password', { exact: true }).fill(NEWCOMER.password);
    await page.getByLabel('Repeat password').fill('something else entirely');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByText('Repeated password does not match.').waitFor();
    await shoot(page, 'register-errors');
    await page.getByLabel('Repeat password').fill(NEWCOMER.password);
    await page.getByRole('button', { name: 'Create account' }).click();

    await page.getByRole('button', { name: 'Accept and join' }).waitFor();
    await shoot(page, 'invitation-signed-in');
    await page.getByRole('button', { name: 'Accept and join' }).click();

    // On the team page as a viewer: the team and its members, no edit controls.
    await page.waitForURL(/\/teams\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { name: TEAM }).waitFor();
    await page.getByTestId('my-role').getByText('Viewer').waitFor();
    await page.getByTestId('members-table').getByText(NEWCOMER.name).waitFor();
    expect(await page.getByTestId('invite-section').count()).toBe(0);
    expect(await page.getByRole('button', { name: /^Remove / }).count()).toBe(0);
    await expect(page.getByTestId('user-menu').textContent()).resolves.toContain(NEWCOMER.name);

    // The other invitation, opened while signed in as the newcomer: the server refuses clearly.
    const otherLink = await linkInMail(server.url, OTHER_INVITEE, '/invitations/');
    await page.goto(otherLink);
    await page.getByTestId('other-address').waitFor();
    await page.getByRole('button', { name: 'Accept and join' }).click();
    const refusal = page.getByTestId('accept-error');
    await refusal.waitFor();
    expect(await refusal.textContent()).toContain(OTHER_INVITEE);
    await shoot(page, 'invitation-other-address');

    // The refused accept is the one expected 4xx of the whole flow.
    expect(failures).toEqual([expect.stringMatching(/^403 POST .*\/accept$/)]);
    await page.close();
  });
});
