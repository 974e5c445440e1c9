/// <reference lib="dom" />

import type { InvitationDto, TeamDto } from '@rampart/collab/api/accounts';

import { ApiClient, linkInMail } from '../utils/api-client';
import { launchBrowser, type TestBrowser } from '../utils/browser';
import { shoot } from '../utils/screenshots';
import { startTestServer, type TestServer } from '../utils/test-server';

// A whole user journey in a real browser on a shared 2-core machine: minutes, not seconds.
jest.setTimeout(180_000);

// Demo accounts seeded by the server (`server/data-access/seed.ts`); local use only.
const PASSWORD = 'rampart-demo';
const OWNER = 'olivia.owner@rampart.test';
const VIEWER = 'vic.viewer@rampart.test';
const TEAM = 'Motor-drive controller team';
const SECOND_TEAM = 'Bench fixtures';

describe('viewer in Chromium: read-only team page', () => {
  let server: TestServer;
  let browser: TestBrowser;
  let demoTeamId: string;
  let secondTeamId: string;

  beforeAll(async () => {
    server = await startTestServer({ SEED_DEMO: 'true' });
    browser = await launchBrowser();

    // Set-up through the API: the owner starts a second team and invites the viewer to it, and
    // the viewer accepts, so the viewer has two teams (the toolbar then shows the switcher).
    const owner = new ApiClient(server.url);
    await owner.signIn(OWNER, PASSWORD);
    const teams = await owner.get<TeamDto[]>('/api/teams');
    demoTeamId = teams.body.find((t) => t.name === TEAM)!.id;
    const second = await owner.post<TeamDto>('/api/teams', { name: SECOND_TEAM });
    expect(second.status).toBe(201);
    secondTeamId = second.body.id;
    const invited = await owner.post<InvitationDto>(`/api/teams/${secondTeamId}/invitations`, {
      email: VIEWER,
      role: 'viewer',
    });
    expect(invited.status).toBe(201);
    const viewer = new ApiClient(server.url);
    await viewer.signIn(VIEWER, PASSWORD);
    const token = new URL(await linkInMail(server.url, VIEWER, '/invitations/')).pathname
      .split('/')
      .pop();
    expect((await viewer.post(`/api/invitations/${token}/accept`)).status).toBe(200);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  test('deep link signed out → sign-in → back on the team page, with no edit controls', async () => {
    const page = await browser.context.newPage();
    const failures: string[] = [];
    page.on('response', (r) => {
      if (r.status() >= 400 && !(r.status() === 401 && r.url().endsWith('/api/auth/me'))) {
        failures.push(`${r.status()} ${r.request().method()} ${r.url()}`);
      }
    });

    await page.goto(`${server.url}/teams/${demoTeamId}`);
    await page.waitForURL(/\/sign-in\?returnUrl=/);
    expect(new URL(page.url()).searchParams.get('returnUrl')).toBe(`/teams/${demoTeamId}`);
    await page.getByLabel('E-mail').fill(VIEWER);
    await page.getByLabel('Password', { exact: true }).fill(PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();

    await page.waitForURL(`${server.url}/teams/${demoTeamId}`);
    await page.getByRole('heading', { name: TEAM }).waitFor();
    await page.getByTestId('my-role').getByText('Viewer').waitFor();
    const rows = page.getByTestId('members-table').locator('tr.mat-mdc-row');
    await rows.first().waitFor();
    expect(await rows.count()).toBe(4);

    // Read-only: no invite form, no role selects, no remove buttons.
    expect(await page.getByTestId('invite-section').count()).toBe(0);
    expect(await page.locator('mat-select.role-select').count()).toBe(0);
    expect(await page.getByRole('button', { name: /^Remove / }).count()).toBe(0);
    expect(await page.getByRole('button', { name: /Send invitation/ }).count()).toBe(0);
    // Reading is still possible: the demo plan is listed as a link.
    await page.getByRole('link', { name: /Motor-drive controller — power-up/ }).waitFor();
    await shoot(page, 'team-viewer');

    // Sorting by role puts the owner first.
    await page.getByRole('button', { name: 'Role' }).click();
    expect(await rows.first().textContent()).toContain('Olivia Owner');

    // Two teams → the switcher in the toolbar moves between them.
    await page.getByTestId('team-switcher').click();
    await page.getByRole('option', { name: SECOND_TEAM }).click();
    await page.waitForURL(`${server.url}/teams/${secondTeamId}`);
    await page.getByRole('heading', { name: SECOND_TEAM }).waitFor();
    expect(await page.getByTestId('invite-section').count()).toBe(0);

    // The user menu: name, change password, sign out.
    await page.getByTestId('user-menu').click();
    await page.getByRole('menuitem', { name: 'Change password' }).waitFor();
    await shoot(page, 'user-menu');
    await page.getByRole('menuitem', { name: 'Change password' }).click();
    await page.getByRole('heading', { name: 'Change password' }).waitFor();
    await page.getByRole('menu').waitFor({ state: 'detached' });
    await shoot(page, 'change-password');

    expect(failures).toEqual([]);
    await page.close();
  });
});
