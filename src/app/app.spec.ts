import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { App } from './app';
import { ME_URL } from './shared/auth/auth-session';
import { apiError, meAs } from './testing/account-fixtures';

const HEALTH = {
  status: 'ok',
  server: { status: 'up', version: '0.1.0', uptimeSeconds: 1 },
  database: { status: 'up', latencyMs: 2, version: 'PostgreSQL 15.18' },
  checkedAt: '2026-12-01T00:00:00.000Z',
};

describe('App shell', () => {
  it('signed out → product name, health answer, safety caution, a Sign in link', async () => {
    TestBed.configureTestingModule({
      imports: [App],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    const fixture = TestBed.createComponent(App);
    const http = TestBed.inject(HttpTestingController);
    fixture.detectChanges();
    // The health poll starts on a timer(0): let that macrotask run before expecting the request.
    await new Promise((resolve) => setTimeout(resolve, 0));
    http.expectOne('/api/health').flush(HEALTH);
    http.expectOne(ME_URL).flush(apiError('unauthenticated', 'Sign in'), {
      status: 401,
      statusText: 'Unauthorized',
    });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const text = el.textContent ?? '';
    expect(text).toContain('Rampart');
    expect(text).toContain('Database up');
    expect(text).toContain('Results are engineering estimates');
    expect(el.querySelector('a[href="/sign-in"]')?.textContent).toContain('Sign in');
    expect(el.querySelector('[data-testid=user-menu]')).toBeNull();
    http.verify();
    fixture.destroy();
  });

  it('signed in with two teams → user name in the toolbar, team switcher, no Sign in link', async () => {
    TestBed.configureTestingModule({
      imports: [App],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    const fixture = TestBed.createComponent(App);
    const http = TestBed.inject(HttpTestingController);
    fixture.detectChanges();
    await new Promise((resolve) => setTimeout(resolve, 0));
    http.expectOne('/api/health').flush(HEALTH);
    http.expectOne(ME_URL).flush(meAs('reviewer'));
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[data-testid=user-menu]')?.textContent).toContain('Reviewer Example');
    expect(el.querySelector('[data-testid=team-switcher]')).not.toBeNull();
    expect(el.querySelector('a[href="/sign-in"]')).toBeNull();
    http.verify();
    fixture.destroy();
  });
});
