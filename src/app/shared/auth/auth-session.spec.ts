import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';

import { TEAM_ID, apiError, meAs } from '../../testing/account-fixtures';
import { OfflineCopyRegistry } from '../plan-session/offline-copy-registry';
import { AuthSession, ME_URL } from './auth-session';
import { CsrfToken } from './csrf-token';

describe('AuthSession', () => {
  let session: AuthSession;
  let http: HttpTestingController;
  let clearUser: jest.Mock<Promise<string[]>, [string]>;

  beforeEach(() => {
    clearUser = jest.fn(async (_userId: string) => ['rampart-plan:user-owner:p1']);
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: OfflineCopyRegistry, useValue: { clearUser } },
      ],
    });
    session = TestBed.inject(AuthSession);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('before any answer → status unknown, no user', () => {
    expect(session.status()).toBe('unknown');
    expect(session.user()).toBeNull();
  });

  it('ensureLoaded() with a 200 → signed in, user and memberships as signals', async () => {
    const done = firstValueFrom(session.ensureLoaded());
    http.expectOne(ME_URL).flush(meAs('editor'));
    await done;
    expect(session.status()).toBe('signed-in');
    expect(session.user()?.email).toBe('editor@rampart.test');
    expect(session.membership(TEAM_ID)?.role).toBe('editor');
    expect(session.memberships()).toHaveLength(2);
  });

  it('ensureLoaded() with a 401 → signed out, resolves null', async () => {
    const done = firstValueFrom(session.ensureLoaded());
    http.expectOne(ME_URL).flush(apiError('unauthenticated', 'Sign in'), {
      status: 401,
      statusText: 'Unauthorized',
    });
    expect(await done).toBeNull();
    expect(session.status()).toBe('signed-out');
  });

  it('ensureLoaded() called twice at once → one request', async () => {
    const a = firstValueFrom(session.ensureLoaded());
    const b = firstValueFrom(session.ensureLoaded());
    http.expectOne(ME_URL).flush(meAs('viewer'));
    expect((await a)?.user.id).toBe('user-viewer');
    expect((await b)?.user.id).toBe('user-viewer');
    // Known now: no further request.
    expect((await firstValueFrom(session.ensureLoaded()))?.user.id).toBe('user-viewer');
  });

  it('ensureLoaded() with a 500 → error, status stays unknown', async () => {
    const done = firstValueFrom(session.ensureLoaded());
    http.expectOne(ME_URL).flush(null, { status: 500, statusText: 'Server Error' });
    await expect(done).rejects.toMatchObject({ status: 500 });
    expect(session.status()).toBe('unknown');
  });

  it("signIn() → POST credentials, signed in, the answer's CSRF token used", async () => {
    const use = jest.spyOn(TestBed.inject(CsrfToken), 'use');
    const done = firstValueFrom(session.signIn('owner@rampart.test', 'correct horse'));
    const req = http.expectOne('/api/auth/sign-in');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ email: 'owner@rampart.test', password: 'correct horse' });
    req.flush({ ...meAs('owner'), csrfToken: 'new-token' });
    await done;
    expect(session.isSignedIn()).toBe(true);
    expect(use).toHaveBeenCalledWith('new-token');
    expect(await firstValueFrom(TestBed.inject(CsrfToken).get())).toBe('new-token');
  });

  it('register() → POST with name, signed in as the new user', async () => {
    const done = firstValueFrom(session.register('new@rampart.test', 'long password 1', 'Nova'));
    const req = http.expectOne('/api/auth/register');
    expect(req.request.body).toEqual({
      email: 'new@rampart.test',
      password: 'long password 1',
      name: 'Nova',
    });
    req.flush({ user: { id: 'u9', email: 'new@rampart.test', name: 'Nova' }, memberships: [] });
    await done;
    expect(session.user()?.name).toBe('Nova');
    expect(session.memberships()).toEqual([]);
  });

  it('signOut() even when the request fails → signed out locally', async () => {
    const signIn = firstValueFrom(session.signIn('a@rampart.test', 'pw'));
    http.expectOne('/api/auth/sign-in').flush(meAs('owner'));
    await signIn;
    const done = firstValueFrom(session.signOut());
    await settle();
    http.expectOne('/api/auth/sign-out').flush(null, { status: 500, statusText: 'Server Error' });
    await expect(done).rejects.toBeDefined();
    expect(session.status()).toBe('signed-out');
    expect(session.user()).toBeNull();
  });

  it("signOut() → deletes the user's offline copies first, then POST sign-out", async () => {
    const signIn = firstValueFrom(session.signIn('a@rampart.test', 'pw'));
    http.expectOne('/api/auth/sign-in').flush(meAs('owner'));
    await signIn;
    let release!: (names: string[]) => void;
    clearUser.mockReturnValueOnce(new Promise((r) => (release = r)));
    const done = firstValueFrom(session.signOut(), { defaultValue: undefined });
    await settle();
    expect(clearUser).toHaveBeenCalledWith('user-owner');
    // No request while the copies are still being deleted.
    http.expectNone('/api/auth/sign-out');
    release(['rampart-plan:user-owner:p1']);
    await settle();
    http.expectOne('/api/auth/sign-out').flush(null, { status: 204, statusText: 'No Content' });
    await done;
    expect(session.status()).toBe('signed-out');
  });

  it('signOut() when deleting the copies fails → still signs out', async () => {
    const signIn = firstValueFrom(session.signIn('a@rampart.test', 'pw'));
    http.expectOne('/api/auth/sign-in').flush(meAs('editor'));
    await signIn;
    clearUser.mockRejectedValueOnce(new Error('IndexedDB broken'));
    const done = firstValueFrom(session.signOut(), { defaultValue: undefined });
    await settle();
    http.expectOne('/api/auth/sign-out').flush(null, { status: 204, statusText: 'No Content' });
    await done;
    expect(clearUser).toHaveBeenCalledWith('user-editor');
    expect(session.status()).toBe('signed-out');
  });

  it('signOut() with nobody signed in → nothing to delete, POST at once', () => {
    session.signOut().subscribe({ error: () => undefined });
    http.expectOne('/api/auth/sign-out').flush(null, { status: 204, statusText: 'No Content' });
    expect(clearUser).not.toHaveBeenCalled();
  });

  it('password calls → the contract routes and bodies', async () => {
    const change = firstValueFrom(session.changePassword('old pass 12', 'new pass 34'), {
      defaultValue: undefined,
    });
    const c = http.expectOne('/api/auth/password');
    expect(c.request.body).toEqual({ currentPassword: 'old pass 12', newPassword: 'new pass 34' });
    c.flush(null, { status: 204, statusText: 'No Content' });
    await change;

    const ask = firstValueFrom(session.requestPasswordReset('a@rampart.test'), {
      defaultValue: undefined,
    });
    const a = http.expectOne('/api/auth/password-reset');
    expect(a.request.body).toEqual({ email: 'a@rampart.test' });
    a.flush(null, { status: 202, statusText: 'Accepted' });
    await ask;

    const confirm = firstValueFrom(session.confirmPasswordReset('tok', 'fresh pass 56'), {
      defaultValue: undefined,
    });
    const f = http.expectOne('/api/auth/password-reset/confirm');
    expect(f.request.body).toEqual({ token: 'tok', password: 'fresh pass 56' });
    f.flush(null, { status: 204, statusText: 'No Content' });
    await confirm;
  });
});

/** Lets pending promises (the copy deletion) run. */
function settle(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve));
}
