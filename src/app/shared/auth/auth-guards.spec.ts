import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ChangeDetectionStrategy, Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import { TEAM_ID, apiError, meAs } from '../../testing/account-fixtures';
import { ALLOWED_ROLES, signedInGuard, signedOutGuard, teamRoleGuard } from './auth-guards';
import { ME_URL } from './auth-session';

@Component({
  selector: 'rp-blank',
  template: 'page',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Blank {}

describe('route guards', () => {
  let router: Router;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([
          { path: 'sign-in', canActivate: [signedOutGuard], component: Blank },
          { path: 'teams', canActivate: [signedInGuard], component: Blank },
          { path: 'teams/:teamId', canActivate: [teamRoleGuard], component: Blank },
          {
            path: 'teams/:teamId/settings',
            canActivate: [teamRoleGuard],
            data: { [ALLOWED_ROLES]: ['owner'] },
            component: Blank,
          },
        ]),
      ],
    });
    router = TestBed.inject(Router);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  /** Navigates, answers who-am-I, and resolves with the URL the router ended on. */
  async function visit(url: string, me: ReturnType<typeof meAs> | null): Promise<string> {
    const done = router.navigateByUrl(url);
    // The router runs guards after a few microtasks; let them start the request.
    await new Promise((resolve) => setTimeout(resolve, 0));
    const req = http.expectOne(ME_URL);
    if (me) req.flush(me);
    else req.flush(apiError('unauthenticated', 'Sign in'), { status: 401, statusText: 'No' });
    await done;
    return router.url;
  }

  it('signedInGuard signed out → /sign-in with the return URL', async () => {
    expect(await visit('/teams', null)).toBe('/sign-in?returnUrl=%2Fteams');
  });

  it('signedInGuard signed in → the page opens', async () => {
    expect(await visit('/teams', meAs('viewer'))).toBe('/teams');
  });

  it('signedOutGuard signed in → /teams instead of the sign-in form', async () => {
    expect(await visit('/sign-in', meAs('viewer'))).toBe('/teams');
  });

  it('signedOutGuard signed in with ?returnUrl= → straight to that page', async () => {
    expect(await visit(`/sign-in?returnUrl=%2Fteams%2F${TEAM_ID}`, meAs('viewer'))).toBe(
      `/teams/${TEAM_ID}`,
    );
  });

  it('teamRoleGuard member of the team → the team page opens', async () => {
    expect(await visit(`/teams/${TEAM_ID}`, meAs('viewer'))).toBe(`/teams/${TEAM_ID}`);
  });

  it('teamRoleGuard not a member → /teams?denied=team', async () => {
    expect(await visit('/teams/someone-elses', meAs('owner'))).toBe('/teams?denied=team');
  });

  it('teamRoleGuard owner-only page as a viewer → /teams?denied=role', async () => {
    expect(await visit(`/teams/${TEAM_ID}/settings`, meAs('viewer'))).toBe('/teams?denied=role');
  });

  it('teamRoleGuard owner-only page as the owner → opens', async () => {
    expect(await visit(`/teams/${TEAM_ID}/settings`, meAs('owner'))).toBe(
      `/teams/${TEAM_ID}/settings`,
    );
  });

  it('teamRoleGuard signed out → /sign-in with the team page as return URL', async () => {
    expect(await visit(`/teams/${TEAM_ID}`, null)).toBe(`/sign-in?returnUrl=%2Fteams%2F${TEAM_ID}`);
  });
});
