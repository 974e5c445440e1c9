import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import { apiError } from '../../testing/account-fixtures';
import { ResetPassword } from './reset-password';

describe('ResetPassword page', () => {
  let http: HttpTestingController;

  async function render(token?: string) {
    TestBed.configureTestingModule({
      imports: [ResetPassword],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const fixture = TestBed.createComponent(ResetPassword);
    if (token) fixture.componentRef.setInput('token', token);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const type = (name: string, value: string) => {
      const input = el.querySelector<HTMLInputElement>(`[formcontrolname=${name}]`)!;
      input.value = value;
      input.dispatchEvent(new Event('input'));
    };
    const submit = async () => {
      el.querySelector('form')!.dispatchEvent(new Event('submit'));
      await fixture.whenStable();
    };
    return { fixture, el, type, submit, navigate };
  }

  afterEach(() => http.verify());

  it('no token → says the link from the e-mail is needed, no form', async () => {
    const { el } = await render();
    expect(el.querySelector('form')).toBeNull();
    expect(el.textContent).toContain('needs the link from the reset e-mail');
  });

  it('token and matching passwords → POST confirm, then sign-in with a notice', async () => {
    const { type, submit, navigate } = await render('tok-123');
    type('password', 'a new long password');
    type('repeat', 'a new long password');
    await submit();
    const req = http.expectOne('/api/auth/password-reset/confirm');
    expect(req.request.body).toEqual({ token: 'tok-123', password: 'a new long password' });
    req.flush(null, { status: 204, statusText: 'No Content' });
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], {
      queryParams: { notice: 'password-reset' },
    });
  });

  it('422 (token used or expired) → the server message and a link to ask again', async () => {
    const { fixture, el, type, submit } = await render('tok-used');
    type('password', 'a new long password');
    type('repeat', 'a new long password');
    await submit();
    http
      .expectOne('/api/auth/password-reset/confirm')
      .flush(apiError('unprocessable', 'This reset link was already used or has expired'), {
        status: 422,
        statusText: 'Unprocessable Entity',
      });
    await fixture.whenStable();
    const message = el.querySelector('[data-testid=form-error]');
    expect(message?.textContent).toContain('already used or has expired');
    expect(message?.querySelector('a')?.getAttribute('href')).toBe('/forgot-password');
  });
});
