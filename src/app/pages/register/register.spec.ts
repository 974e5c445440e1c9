import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import { apiError } from '../../testing/account-fixtures';
import { Register } from './register';

describe('Register page', () => {
  let http: HttpTestingController;

  async function render(inputs: Record<string, string> = {}) {
    TestBed.configureTestingModule({
      imports: [Register],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    const fixture = TestBed.createComponent(Register);
    for (const [k, v] of Object.entries(inputs)) fixture.componentRef.setInput(k, v);
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
    const errors = () => [...el.querySelectorAll('mat-error')].map((e) => e.textContent?.trim());
    return { fixture, el, input, type, submit, errors, navigate };
  }

  afterEach(() => http.verify());

  it('?email= from an invitation → the e-mail field is prefilled', async () => {
    const { input } = await render({ email: 'trainee@rampart.test' });
    expect(input('email').value).toBe('trainee@rampart.test');
  });

  it('short password and different repeat → both inline messages, no request', async () => {
    const { type, submit, errors } = await render();
    type('name', 'Nova');
    type('email', 'nova@rampart.test');
    type('password', 'short');
    type('repeat', 'shorter');
    await submit();
    expect(errors()).toEqual([
      'Password needs at least 10 characters.',
      'Repeated password does not match.',
    ]);
    http.expectNone('/api/auth/register');
  });

  it('409 with a field error → message under the e-mail field', async () => {
    const { fixture, type, submit, errors } = await render();
    type('name', 'Nova');
    type('email', 'owner@rampart.test');
    type('password', 'long enough pass');
    type('repeat', 'long enough pass');
    await submit();
    http
      .expectOne('/api/auth/register')
      .flush(
        apiError('conflict', 'An account with this e-mail exists', [
          { path: 'email', message: 'An account with this e-mail exists' },
        ]),
        { status: 409, statusText: 'Conflict' },
      );
    await fixture.whenStable();
    expect(errors()).toEqual(['An account with this e-mail exists']);
  });

  it('valid submit → POST with trimmed name and e-mail, then to the return URL', async () => {
    const { type, submit, navigate } = await render({ returnUrl: '/invitations/tok' });
    type('name', '  Nova  ');
    type('email', 'nova@rampart.test');
    type('password', 'long enough pass');
    type('repeat', 'long enough pass');
    await submit();
    const req = http.expectOne('/api/auth/register');
    expect(req.request.body).toEqual({
      email: 'nova@rampart.test',
      password: 'long enough pass',
      name: 'Nova',
    });
    req.flush({ user: { id: 'u1', email: 'nova@rampart.test', name: 'Nova' }, memberships: [] });
    expect(navigate).toHaveBeenCalledWith('/invitations/tok');
  });
});
