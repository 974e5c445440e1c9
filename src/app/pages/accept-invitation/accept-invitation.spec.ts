import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { Router, provideRouter } from '@angular/router';

import type { InvitationPreview } from '@rampart/collab/api/accounts';

import { ME_URL } from '../../shared/auth/auth-session';
import { OfflineCopyRegistry } from '../../shared/plan-session/offline-copy-registry';
import { TEAM_ID, TEAM_NAME, apiError, meAs } from '../../testing/account-fixtures';
import { AcceptInvitation } from './accept-invitation';

const TOKEN = 'a'.repeat(43);
const PREVIEW: InvitationPreview = {
  teamName: TEAM_NAME,
  email: 'viewer@rampart.test',
  role: 'viewer',
  invitedBy: 'Owner Example',
  expiresAt: '2026-12-08T09:00:00.000Z',
};

describe('AcceptInvitation page', () => {
  let http: HttpTestingController;

  async function render(me: ReturnType<typeof meAs> | null, unsentEdits = 0) {
    TestBed.configureTestingModule({
      imports: [AcceptInvitation],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        {
          provide: OfflineCopyRegistry,
          useValue: { unsentEdits: async () => unsentEdits, clearUser: clearCopies },
        },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const fixture = TestBed.createComponent(AcceptInvitation);
    fixture.componentRef.setInput('token', TOKEN);
    fixture.detectChanges();
    const meReq = http.expectOne(ME_URL);
    if (me) meReq.flush(me);
    else meReq.flush(apiError('unauthenticated', 'Sign in'), { status: 401, statusText: 'No' });
    http.expectOne(`/api/invitations/${TOKEN}`).flush(PREVIEW);
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement, navigate };
  }

  let clearCopies: jest.Mock<Promise<string[]>, [string]>;
  beforeEach(() => {
    clearCopies = jest.fn(async (_userId: string): Promise<string[]> => []);
  });
  afterEach(() => {
    http.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((e) => e.remove());
  });

  it('signed out → the offer, and sign-in / register links that come back here', async () => {
    const { el } = await render(null);
    expect(el.querySelector('[data-testid=invitation-offer]')?.textContent).toContain(TEAM_NAME);
    const hrefs = [...el.querySelectorAll('a')].map((a) => a.getAttribute('href'));
    const back = encodeURIComponent(`/invitations/${TOKEN}`);
    expect(hrefs).toContain(`/sign-in?returnUrl=${back}`);
    expect(hrefs).toContain(`/register?returnUrl=${back}&email=${PREVIEW.email}`);
    expect(el.textContent).not.toContain('Accept and join');
  });

  it('signed in as the invited address → accept → POST, who-am-I again, on to the team', async () => {
    const { fixture, el, navigate } = await render(meAs('viewer', 'viewer@rampart.test'));
    expect(el.querySelector('[data-testid=other-address]')).toBeNull();
    const accept = [...el.querySelectorAll('button')].find((b) =>
      b.textContent?.includes('Accept and join'),
    )!;
    accept.click();
    await fixture.whenStable();
    http
      .expectOne(`/api/invitations/${TOKEN}/accept`)
      .flush({ id: TEAM_ID, name: TEAM_NAME, role: 'viewer' });
    http.expectOne(ME_URL).flush(meAs('viewer', 'viewer@rampart.test'));
    expect(navigate).toHaveBeenCalledWith(['/teams', TEAM_ID]);
  });

  it('signed in as another address → a notice, and the server refusal shown on accept', async () => {
    const { fixture, el } = await render(meAs('owner', 'someone.else@rampart.test'));
    expect(el.querySelector('[data-testid=other-address]')?.textContent).toContain(
      'someone.else@rampart.test',
    );
    [...el.querySelectorAll('button')]
      .find((b) => b.textContent?.includes('Accept and join'))!
      .click();
    await fixture.whenStable();
    const refusal =
      'This invitation is for viewer@rampart.test, but you are signed in as someone.else@rampart.test';
    http
      .expectOne(`/api/invitations/${TOKEN}/accept`)
      .flush(apiError('forbidden', refusal), { status: 403, statusText: 'Forbidden' });
    await fixture.whenStable();
    expect(el.querySelector('[data-testid=accept-error]')?.textContent).toContain(refusal);
  });

  it('another address with 2 unsent edits → "Sign out and use…" asks; Cancel keeps all, confirm signs out', async () => {
    const { fixture, el, navigate } = await render(meAs('owner', 'someone.else@rampart.test'), 2);
    const switchButton = () =>
      [...el.querySelectorAll('button')].find((b) => b.textContent?.includes('Sign out and use'))!;
    const dialogButton = (label: string) =>
      [...document.querySelectorAll<HTMLButtonElement>('mat-dialog-container button')].find(
        (b) => b.textContent?.trim() === label,
      );
    const settle = () => new Promise((resolve) => setTimeout(resolve));

    switchButton().click();
    await settle();
    await fixture.whenStable();
    expect(document.querySelector('mat-dialog-container')?.textContent).toContain(
      '2 edits made in this browser have not reached the server yet',
    );
    dialogButton('Cancel')!.click();
    await settle();
    await fixture.whenStable();
    http.expectNone('/api/auth/sign-out');
    expect(clearCopies).not.toHaveBeenCalled();
    expect(navigate).not.toHaveBeenCalled();

    switchButton().click();
    await settle();
    await fixture.whenStable();
    dialogButton('Sign out anyway')!.click();
    await settle();
    await fixture.whenStable();
    expect(clearCopies).toHaveBeenCalledTimes(1);
    http.expectOne('/api/auth/sign-out').flush(null);
    await settle();
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], {
      queryParams: { returnUrl: `/invitations/${TOKEN}` },
    });
  });

  it('unknown or withdrawn invitation (404) → a clear message instead of the offer', async () => {
    TestBed.configureTestingModule({
      imports: [AcceptInvitation],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(AcceptInvitation);
    fixture.componentRef.setInput('token', TOKEN);
    fixture.detectChanges();
    http.expectOne(ME_URL).flush(meAs('viewer'));
    http
      .expectOne(`/api/invitations/${TOKEN}`)
      .flush(apiError('not_found', 'No such invitation'), { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[data-testid=invitation-error]')?.textContent).toContain(
      'does not exist, was already used, or has expired',
    );
  });
});
