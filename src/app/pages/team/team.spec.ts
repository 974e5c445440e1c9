import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { By } from '@angular/platform-browser';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { Role } from '@rampart/collab/api/accounts';

import { AuthSession, ME_URL } from '../../shared/auth/auth-session';
import { TEAM_ID, apiError, meAs, membersOfTeam } from '../../testing/account-fixtures';
import { MembersTable } from './members-table';
import { Team } from './team';

const MEMBERS_URL = `/api/teams/${TEAM_ID}/members`;

describe('Team page', () => {
  let http: HttpTestingController;

  /** Signs in as `role`, opens the page and answers its first requests. */
  async function render(role: Role) {
    TestBed.configureTestingModule({
      imports: [Team],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        // The dialog reports "closed" only after its exit animation, which jsdom never runs.
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    const loaded = firstValueFrom(TestBed.inject(AuthSession).ensureLoaded());
    http.expectOne(ME_URL).flush(meAs(role));
    await loaded;

    const fixture = TestBed.createComponent(Team);
    fixture.componentRef.setInput('teamId', TEAM_ID);
    fixture.detectChanges();
    http.expectOne(MEMBERS_URL).flush(membersOfTeam());
    if (role === 'owner') http.expectOne(`/api/teams/${TEAM_ID}/invitations`).flush([]);
    http.expectOne('/api/plans').flush([
      {
        id: 'plan-1',
        slug: 'motor-drive-bring-up',
        name: 'Motor-drive bring-up',
        teamId: TEAM_ID,
        role,
        updatedAt: '2026-11-20T10:00:00.000Z',
      },
      { id: 'plan-x', slug: 'x', name: 'Other team plan', teamId: 'other', role, updatedAt: '' },
    ]);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    return { fixture, el };
  }

  afterEach(() => http.verify());

  function editControls(el: HTMLElement) {
    return {
      invite: el.querySelectorAll('[data-testid=invite-section]').length,
      roleSelects: el.querySelectorAll('mat-select.role-select').length,
      removeButtons: el.querySelectorAll('button[aria-label^="Remove "]').length,
    };
  }

  it.each(['viewer', 'reviewer'] as const)(
    '%s → members listed, no invite form, no role selects, no remove buttons',
    async (role) => {
      const { el } = await render(role);
      expect(el.querySelectorAll('tr.mat-mdc-row')).toHaveLength(4);
      expect(editControls(el)).toEqual({ invite: 0, roleSelects: 0, removeButtons: 0 });
      expect(el.querySelector('[data-testid=my-role]')?.textContent).toContain(
        role === 'viewer' ? 'Viewer' : 'Reviewer',
      );
    },
  );

  it('editor → no member controls either', async () => {
    const { el } = await render('editor');
    expect(editControls(el)).toEqual({ invite: 0, roleSelects: 0, removeButtons: 0 });
  });

  it('owner → invite form, a role select per member, remove on everyone but self', async () => {
    const { el } = await render('owner');
    expect(editControls(el)).toEqual({ invite: 1, roleSelects: 4, removeButtons: 3 });
  });

  it("plans → only this team's plans, as links to /plans/:id", async () => {
    const { el } = await render('viewer');
    const links = [...el.querySelectorAll<HTMLAnchorElement>('a[href^="/plans/"]')];
    expect(links.map((a) => a.getAttribute('href'))).toEqual(['/plans/plan-1']);
  });

  it('owner picks a new role → PATCH with the role, success notice, members reloaded', async () => {
    const { fixture, el } = await render('owner');
    const table = fixture.debugElement.query(By.directive(MembersTable))
      .componentInstance as MembersTable;
    const viewer = membersOfTeam()[3];
    table.roleChange.emit({ member: viewer, role: 'reviewer' });
    const req = http.expectOne(`${MEMBERS_URL}/user-viewer`);
    expect(req.request.method).toBe('PATCH');
    expect(req.request.body).toEqual({ role: 'reviewer' });
    req.flush({ ...viewer, role: 'reviewer' });
    http.expectOne(MEMBERS_URL).flush(membersOfTeam());
    await fixture.whenStable();
    expect(el.querySelector('[data-testid=team-notice]')?.textContent).toContain(
      'Viewer Example is now reviewer.',
    );
  });

  it('role change refused (last owner) → the server message, members reloaded', async () => {
    const { fixture, el } = await render('owner');
    const table = fixture.debugElement.query(By.directive(MembersTable))
      .componentInstance as MembersTable;
    table.roleChange.emit({ member: membersOfTeam()[0], role: 'viewer' });
    http
      .expectOne(`${MEMBERS_URL}/user-owner`)
      .flush(apiError('conflict', 'The last owner cannot be demoted'), {
        status: 409,
        statusText: 'Conflict',
      });
    http.expectOne(MEMBERS_URL).flush(membersOfTeam());
    // Own role: who-am-I is not asked again after a refusal.
    http.expectNone(ME_URL);
    await fixture.whenStable();
    expect(el.querySelector('[data-testid=team-notice]')?.textContent).toContain(
      'The last owner cannot be demoted',
    );
  });

  /** Clicks a button by its words, in the page or in the dialog overlay. */
  function click(root: ParentNode, words: string): void {
    const button = [...root.querySelectorAll('button')].find((b) =>
      b.textContent?.trim().endsWith(words),
    );
    if (!button) throw new Error(`no button "${words}"`);
    button.click();
  }

  it('leave → confirm → DELETE own membership, who-am-I again, then /teams', async () => {
    const { fixture, el } = await render('viewer');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    click(el, 'Leave team');
    await fixture.whenStable();
    const dialog = document.querySelector('mat-dialog-container');
    expect(dialog?.textContent).toContain(`Leave Motor-drive controller?`);
    click(dialog!, 'Leave team');
    await fixture.whenStable();
    const req = http.expectOne(`${MEMBERS_URL}/user-viewer`);
    expect(req.request.method).toBe('DELETE');
    req.flush(null, { status: 204, statusText: 'No Content' });
    http.expectOne(ME_URL).flush({ ...meAs('viewer'), memberships: [] });
    expect(navigate).toHaveBeenCalledWith(['/teams']);
  });

  it('leave → cancel → nothing sent', async () => {
    const { fixture, el } = await render('viewer');
    click(el, 'Leave team');
    await fixture.whenStable();
    click(document.querySelector('mat-dialog-container')!, 'Cancel');
    await fixture.whenStable();
    http.expectNone(`${MEMBERS_URL}/user-viewer`);
  });

  it('last owner leaves → 409 → the server message on the page', async () => {
    const { fixture, el } = await render('owner');
    click(el, 'Leave team');
    await fixture.whenStable();
    click(document.querySelector('mat-dialog-container')!, 'Leave team');
    await fixture.whenStable();
    http
      .expectOne(`${MEMBERS_URL}/user-owner`)
      .flush(apiError('conflict', 'The last owner cannot leave the team'), {
        status: 409,
        statusText: 'Conflict',
      });
    await fixture.whenStable();
    expect(el.querySelector('[data-testid=team-notice]')?.textContent).toContain(
      'The last owner cannot leave the team',
    );
  });
});
