import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import { meAs } from '../../testing/account-fixtures';
import { OfflineCopyRegistry } from '../plan-session/offline-copy-registry';
import { AuthSession, ME_URL } from './auth-session';
import { discardQuestion } from './sign-out-flow';
import { UserMenu } from './user-menu';

/** Lets pending promises and dialog openings run. */
const settle = () => new Promise((resolve) => setTimeout(resolve));

describe('UserMenu', () => {
  let http: HttpTestingController;
  let session: AuthSession;
  let navigate: jest.SpyInstance;
  let unsentEdits: jest.Mock<Promise<number>, [string]>;
  let clearUser: jest.Mock<Promise<string[]>, [string]>;

  async function openMenu(): Promise<HTMLElement[]> {
    TestBed.configureTestingModule({
      imports: [UserMenu],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        { provide: OfflineCopyRegistry, useValue: { unsentEdits, clearUser } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    session = TestBed.inject(AuthSession);
    const loaded = firstValueFrom(session.ensureLoaded());
    http.expectOne(ME_URL).flush(meAs('reviewer'));
    await loaded;
    navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const fixture = TestBed.createComponent(UserMenu);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const trigger = el.querySelector<HTMLButtonElement>('[data-testid=user-menu]')!;
    expect(trigger.textContent).toContain('Reviewer Example');
    trigger.click();
    await fixture.whenStable();
    return [...document.querySelectorAll<HTMLElement>('[mat-menu-item]')];
  }

  const dialog = () => document.querySelector<HTMLElement>('mat-dialog-container');
  const dialogButton = (label: string) =>
    [...(dialog()?.querySelectorAll<HTMLButtonElement>('button') ?? [])].find(
      (b) => b.textContent?.trim() === label,
    );

  beforeEach(() => {
    unsentEdits = jest.fn(async (_userId: string) => 0);
    clearUser = jest.fn(async (_userId: string): Promise<string[]> => []);
  });
  afterEach(() => {
    http.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((e) => e.remove());
  });

  it('shows the name; Sign out → copies deleted, POST sign-out, /sign-in with a notice', async () => {
    const items = await openMenu();
    expect(items.map((i) => i.textContent?.replace(/\s+/g, ' ').trim())).toEqual([
      'groups Your teams',
      'key Change password',
      'logout Sign out',
    ]);
    items[2].click();
    await settle();
    expect(dialog()).toBeNull();
    expect(unsentEdits).toHaveBeenCalledWith('user-reviewer');
    http.expectOne('/api/auth/sign-out').flush(null, { status: 204, statusText: 'No Content' });
    expect(clearUser).toHaveBeenCalledWith('user-reviewer');
    expect(session.status()).toBe('signed-out');
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { notice: 'signed-out' } });
  });

  it('Sign out with 3 unsent edits → asks with the count; Cancel → still signed in, nothing deleted', async () => {
    unsentEdits.mockResolvedValue(3);
    const items = await openMenu();
    items[2].click();
    await settle();
    expect(dialog()?.textContent).toContain('Discard unsent edits?');
    expect(dialog()?.textContent).toContain('3 edits made in this browser have not reached');
    dialogButton('Cancel')!.click();
    await settle();
    expect(dialog()).toBeNull();
    http.expectNone('/api/auth/sign-out');
    expect(clearUser).not.toHaveBeenCalled();
    expect(session.status()).toBe('signed-in');
    expect(navigate).not.toHaveBeenCalled();
  });

  it('Sign out with 1 unsent edit → Sign out anyway → copies deleted and signed out', async () => {
    unsentEdits.mockResolvedValue(1);
    const items = await openMenu();
    items[2].click();
    await settle();
    expect(dialog()?.textContent).toContain('1 edit made in this browser has not reached');
    dialogButton('Sign out anyway')!.click();
    await settle();
    expect(clearUser).toHaveBeenCalledWith('user-reviewer');
    http.expectOne('/api/auth/sign-out').flush(null, { status: 204, statusText: 'No Content' });
    expect(session.status()).toBe('signed-out');
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { notice: 'signed-out' } });
  });

  it('discardQuestion → singular and plural wording, Sign out anyway', () => {
    expect(discardQuestion(1)).toEqual({
      title: 'Discard unsent edits?',
      message:
        '1 edit made in this browser has not reached the server yet. Signing out deletes the ' +
        'copies of your plans kept in this browser, and that edit with them. Cancel to stay ' +
        'signed in: unsent edits are sent as soon as the connection is back.',
      confirm: 'Sign out anyway',
    });
    expect(discardQuestion(2).message).toMatch(
      /^2 edits made in this browser have not .* those edits with them/,
    );
  });
});
