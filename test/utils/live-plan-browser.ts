/**
 * Shared pieces of the live-plan browser tests: demo users signed in over the API and handed to
 * a fresh Chromium profile, the demo plan's id, and the parts-table locators.
 */
import type { BrowserContext, Page } from 'playwright-core';

import type { MeResponse, PlanSummaryDto } from '@rampart/collab/api/accounts';

import { ApiClient } from './api-client';
import { launchBrowser, type TestBrowser } from './browser';
import type { TestServer } from './test-server';

/** Password of every demo user (README). */
export const DEMO_PASSWORD = 'rampart-demo';
export const DEMO_SLUG = 'motor-drive-controller';

/** A demo user in a browser of their own; `errors` collects console errors and page errors. */
export interface Person {
  email: string;
  name: string;
  id?: string;
  browser?: TestBrowser;
  page?: Page;
  errors: string[];
}

export interface OpenOptions {
  /** Runs on the fresh browser context before the page opens (routes, for instance). */
  prepare?: (context: BrowserContext) => Promise<void>;
  /** Console errors matching this are the test's own doing and are not collected. */
  ignoreConsole?: RegExp;
}

/** Signs in over the API, hands the session cookie to a fresh browser profile, opens the plan. */
export async function openAs(
  server: TestServer,
  person: Person,
  planId: string,
  options: OpenOptions = {},
): Promise<Page> {
  const api = new ApiClient(server.url);
  await api.signIn(person.email, DEMO_PASSWORD);
  person.id = (await api.get<MeResponse>('/api/auth/me')).body.user.id;
  person.browser = await launchBrowser();
  const { context } = person.browser;
  await options.prepare?.(context);
  await context.addCookies(
    [...api.cookies].map(([name, value]) => ({ name, value, url: server.url })),
  );
  const page = await context.newPage();
  page.on('console', (m) => {
    if (m.type() !== 'error') return;
    if (options.ignoreConsole?.test(m.text())) return;
    person.errors.push(m.text());
  });
  page.on('pageerror', (e) => person.errors.push(e.message));
  await page.goto(`${server.url}/plans/${planId}`);
  person.page = page;
  return page;
}

/** The id of the seeded demo plan, looked up as `signInAs` sees the plans list. */
export async function demoPlanId(server: TestServer, signInAs: string): Promise<string> {
  const api = new ApiClient(server.url);
  await api.signIn(signInAs, DEMO_PASSWORD);
  const plans = await api.get<PlanSummaryDto[]>('/api/plans');
  const demo = plans.body.find((p) => p.slug === DEMO_SLUG);
  if (!demo) throw new Error(`demo plan ${DEMO_SLUG} missing: ${JSON.stringify(plans.body)}`);
  return demo.id;
}

/** The value or tolerance field of a part's row in the parts table. */
export const valueInput = (page: Page, part: string, field: 'value' | 'tolerance' = 'value') =>
  page.locator(`tr[data-part="${part}"] input[data-field="${field}"]`);
