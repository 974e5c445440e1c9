import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import { apiError, meAs } from '../../testing/account-fixtures';
import { SignIn } from './sign-in';

describe('SignIn page', () => {
  let http: HttpTestingController;

  async function render(returnUrl?: string) {
    TestBed.configureTestingModule({
      imports: [SignIn],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    const router = TestBed.inject(Router);
    const navigate = jest.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    const fixture = TestBed.createComponent(SignIn);
    if (returnUrl) fixture.componentRef.setInput('returnUrl', returnUrl);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const input = (name: string) =>
      el.querySelector<HTMLInputElement>(`[formcontrolname=${name}]`)!;
    const type = (name: string, value: string) => {
      input(name).value = value;
      input(name).dispatchEvent(new Event('input'));
    };
    const submit = async () => {
      el.querySelector('form')!.dispatchEvent(new Event('submit'));
      await fixture.whenStable();
    };
    const button = () => el.querySelector<HTMLButtonElement>('button[type=submit]')!;
    return { fixture, el, type, submit, button, navigate };
  }

  afterEach(() => http.verify());

  it('submit empty → inline "is required" messages and no request', async () => {
    const { el, submit } = await render();
    await submit();
    const errors = [...el.querySelectorAll('mat-error')].map((e) => e.textContent?.trim());
    expect(errors).toEqual(['E-mail is required.', 'Password is required.']);
    http.expectNone('/api/auth/sign-in');
  });

  it('bad e-mail → e-mail format message under the field', async () => {
    const { el, type, submit } = await render();
    type('email', 'not-an-address');
    type('password', 'whatever');
    await submit();
    expect(el.querySelector('mat-error')?.textContent).toContain('must be an e-mail address');
  });

  it('valid submit → button disabled while pending, then navigates to the return URL', async () => {
    const { type, submit, button, navigate } = await render('/invitations/abc');
    type('email', ' owner@rampart.test ');
    type('password', 'correct horse battery');
    await submit();
    expect(button().disabled).toBe(true);
    const req = http.expectOne('/api/auth/sign-in');
    expect(req.request.body).toEqual({
      email: 'owner@rampart.test',
      password: 'correct horse battery',
    });
    req.flush(meAs('owner'));
    expect(navigate).toHaveBeenCalledWith('/invitations/abc');
  });

  it('returnUrl to another site → goes to /teams instead', async () => {
    const { type, submit, navigate } = await render('https://elsewhere.example/');
    type('email', 'owner@rampart.test');
    type('password', 'pw');
    await submit();
    http.expectOne('/api/auth/sign-in').flush(meAs('owner'));
    expect(navigate).toHaveBeenCalledWith('/teams');
  });

  it('401 from the server → its message shown in the form, button enabled again', async () => {
    const { fixture, el, type, submit, button } = await render();
    type('email', 'owner@rampart.test');
    type('password', 'wrong');
    await submit();
    http
      .expectOne('/api/auth/sign-in')
      .flush(apiError('unauthenticated', 'E-mail or password is wrong'), {
        status: 401,
        statusText: 'Unauthorized',
      });
    await fixture.whenStable();
    expect(el.querySelector('[data-testid=form-error]')?.textContent).toContain(
      'E-mail or password is wrong',
    );
    expect(button().disabled).toBe(false);
  });

  it('429 → the throttling message in the form', async () => {
    const { fixture, el, type, submit } = await render();
    type('email', 'owner@rampart.test');
    type('password', 'wrong');
    await submit();
    http
      .expectOne('/api/auth/sign-in')
      .flush(apiError('rate_limited', 'Too many sign-in attempts; try again in 60 s'), {
        status: 429,
        statusText: 'Too Many Requests',
      });
    await fixture.whenStable();
    expect(el.textContent).toContain('Too many sign-in attempts; try again in 60 s');
  });
});
