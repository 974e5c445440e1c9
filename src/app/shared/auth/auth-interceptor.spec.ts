import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ChangeDetectionStrategy, Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import { apiError, meAs } from '../../testing/account-fixtures';
import { authInterceptor } from './auth-interceptor';
import { AuthSession } from './auth-session';
import { CSRF_HEADER, CSRF_URL } from './csrf-token';

@Component({
  selector: 'rp-blank',
  template: 'page',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Blank {}

describe('authInterceptor', () => {
  let client: HttpClient;
  let http: HttpTestingController;
  let router: Router;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: '**', component: Blank }]),
        provideHttpClient(withInterceptors([authInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    client = TestBed.inject(HttpClient);
    http = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
  });
  afterEach(() => http.verify());

  it('POST to the API → token fetched first, then sent in x-csrf-token', async () => {
    const done = firstValueFrom(client.post('/api/teams', { name: 'Bring-up' }));
    http.expectOne(CSRF_URL).flush({ token: 'tok-1' });
    const req = http.expectOne('/api/teams');
    expect(req.request.headers.get(CSRF_HEADER)).toBe('tok-1');
    req.flush({});
    await done;
  });

  it('two POSTs → one token request, both carry the token', async () => {
    const a = firstValueFrom(client.post('/api/a', {}));
    const b = firstValueFrom(client.delete('/api/b'));
    http.expectOne(CSRF_URL).flush({ token: 'tok-1' });
    const reqA = http.expectOne('/api/a');
    const reqB = http.expectOne('/api/b');
    expect([reqA, reqB].map((r) => r.request.headers.get(CSRF_HEADER))).toEqual(['tok-1', 'tok-1']);
    reqA.flush({});
    reqB.flush(null);
    await Promise.all([a, b]);
  });

  it('GET → no token, no token request', async () => {
    const done = firstValueFrom(client.get('/api/teams'));
    const req = http.expectOne('/api/teams');
    expect(req.request.headers.has(CSRF_HEADER)).toBe(false);
    req.flush([]);
    await done;
  });

  it('POST outside /api → left alone', async () => {
    const done = firstValueFrom(client.post('/elsewhere', {}));
    const req = http.expectOne('/elsewhere');
    expect(req.request.headers.has(CSRF_HEADER)).toBe(false);
    req.flush({});
    await done;
  });

  it('403 csrf_invalid → token fetched again and the request retried once with it', async () => {
    const done = firstValueFrom(client.patch('/api/teams/t/members/u', { role: 'viewer' }));
    http.expectOne(CSRF_URL).flush({ token: 'stale' });
    http.expectOne('/api/teams/t/members/u').flush(apiError('csrf_invalid', 'Invalid CSRF token'), {
      status: 403,
      statusText: 'Forbidden',
    });
    http.expectOne(CSRF_URL).flush({ token: 'fresh' });
    const retry = http.expectOne('/api/teams/t/members/u');
    expect(retry.request.headers.get(CSRF_HEADER)).toBe('fresh');
    retry.flush({ ok: true });
    expect(await done).toEqual({ ok: true });
  });

  it('403 for another reason → passed through, no retry', async () => {
    const done = firstValueFrom(client.post('/api/teams/t/invitations', {}));
    http.expectOne(CSRF_URL).flush({ token: 'tok' });
    http
      .expectOne('/api/teams/t/invitations')
      .flush(apiError('forbidden', 'Only owners invite'), { status: 403, statusText: 'Forbidden' });
    await expect(done).rejects.toMatchObject({ status: 403 });
  });

  it('401 on an ordinary route → signed out and sent to /sign-in?returnUrl=<current page>', async () => {
    await router.navigateByUrl('/teams/t1');
    const session = TestBed.inject(AuthSession);
    const navigate = jest.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    const done = firstValueFrom(client.get('/api/teams/t1/members'));
    http.expectOne('/api/teams/t1/members').flush(apiError('unauthenticated', 'Sign in first'), {
      status: 401,
      statusText: 'Unauthorized',
    });
    await expect(done).rejects.toMatchObject({ status: 401 });
    expect(session.status()).toBe('signed-out');
    const target = navigate.mock.calls[0]?.[0];
    expect(router.serializeUrl(target as ReturnType<Router['parseUrl']>)).toBe(
      '/sign-in?returnUrl=%2Fteams%2Ft1',
    );
  });

  it.each(['/api/auth/me', '/api/auth/sign-in', '/api/auth/password'])(
    '401 on %s → no redirect (it is an answer, not a lost session)',
    async (url) => {
      const navigate = jest.spyOn(router, 'navigateByUrl');
      const done = firstValueFrom(url === '/api/auth/me' ? client.get(url) : client.post(url, {}));
      if (url !== '/api/auth/me') http.expectOne(CSRF_URL).flush({ token: 'tok' });
      http
        .expectOne(url)
        .flush(apiError('unauthenticated', 'No'), { status: 401, statusText: 'Unauthorized' });
      await expect(done).rejects.toMatchObject({ status: 401 });
      expect(navigate).not.toHaveBeenCalled();
    },
  );

  it('after sign-in → the next POST sends the token from the sign-in answer', async () => {
    const session = TestBed.inject(AuthSession);
    const signIn = firstValueFrom(session.signIn('owner@rampart.test', 'pw'));
    http.expectOne(CSRF_URL).flush({ token: 'before' });
    http.expectOne('/api/auth/sign-in').flush({ ...meAs('owner'), csrfToken: 'after' });
    await signIn;
    const next = firstValueFrom(client.post('/api/teams', {}));
    const req = http.expectOne('/api/teams');
    expect(req.request.headers.get(CSRF_HEADER)).toBe('after');
    req.flush({});
    await next;
  });

  it('sign-in answer without a token → the next POST fetches a new one', async () => {
    const session = TestBed.inject(AuthSession);
    const signIn = firstValueFrom(session.signIn('owner@rampart.test', 'pw'));
    http.expectOne(CSRF_URL).flush({ token: 'before' });
    http.expectOne('/api/auth/sign-in').flush(meAs('owner'));
    await signIn;
    const next = firstValueFrom(client.post('/api/teams', {}));
    http.expectOne(CSRF_URL).flush({ token: 'fetched' });
    const req = http.expectOne('/api/teams');
    expect(req.request.headers.get(CSRF_HEADER)).toBe('fetched');
    req.flush({});
    await next;
  });

  it('x-csrf-token response header (password change) → used on the next POST', async () => {
    const change = firstValueFrom(client.post('/api/auth/password', {}));
    http.expectOne(CSRF_URL).flush({ token: 'old' });
    http.expectOne('/api/auth/password').flush(null, {
      status: 204,
      statusText: 'No Content',
      headers: { [CSRF_HEADER]: 'rotated' },
    });
    await change;
    const next = firstValueFrom(client.post('/api/teams', {}));
    const req = http.expectOne('/api/teams');
    expect(req.request.headers.get(CSRF_HEADER)).toBe('rotated');
    req.flush({});
    await next;
  });
});
