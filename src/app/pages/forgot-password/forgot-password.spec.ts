import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { ForgotPassword } from './forgot-password';

describe('ForgotPassword page', () => {
  it('e-mail sent → 202 → the same neutral confirmation for any address', async () => {
    TestBed.configureTestingModule({
      imports: [ForgotPassword],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ForgotPassword);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const input = el.querySelector<HTMLInputElement>('[formcontrolname=email]')!;
    input.value = 'nobody@rampart.test';
    input.dispatchEvent(new Event('input'));
    el.querySelector('form')!.dispatchEvent(new Event('submit'));
    await fixture.whenStable();
    const req = http.expectOne('/api/auth/password-reset');
    expect(req.request.body).toEqual({ email: 'nobody@rampart.test' });
    req.flush(null, { status: 202, statusText: 'Accepted' });
    await fixture.whenStable();
    expect(el.querySelector('[data-testid=reset-sent]')?.textContent).toContain(
      'If nobody@rampart.test has a Rampart account',
    );
    http.verify();
  });
});
