import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { apiError } from '../../testing/account-fixtures';
import { ChangePassword } from './change-password';

describe('ChangePassword page', () => {
  let http: HttpTestingController;

  async function render() {
    TestBed.configureTestingModule({
      imports: [ChangePassword],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ChangePassword);
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
    const errors = () => [...el.querySelectorAll('mat-error')].map((e) => e.textContent?.trim());
    return { fixture, el, type, submit, errors };
  }

  afterEach(() => http.verify());

  it('new password equal to the current one → inline message, no request', async () => {
    const { type, submit, errors } = await render();
    type('currentPassword', 'same old password');
    type('newPassword', 'same old password');
    type('repeat', 'same old password');
    await submit();
    expect(errors()).toEqual(['New password must differ from the current password.']);
    http.expectNone('/api/auth/password');
  });

  it('saved → confirmation, fields emptied without "is required" messages', async () => {
    const { fixture, el, type, submit, errors } = await render();
    type('currentPassword', 'old password 1');
    type('newPassword', 'new password 22');
    type('repeat', 'new password 22');
    await submit();
    http.expectOne('/api/auth/password').flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(el.querySelector('[data-testid=saved]')).not.toBeNull();
    expect(el.querySelector<HTMLInputElement>('[formcontrolname=newPassword]')!.value).toBe('');
    expect(errors()).toEqual([]);
  });

  it('wrong current password (field error) → message under "Current password"', async () => {
    const { fixture, type, submit, errors } = await render();
    type('currentPassword', 'wrong password');
    type('newPassword', 'new password 22');
    type('repeat', 'new password 22');
    await submit();
    http
      .expectOne('/api/auth/password')
      .flush(
        apiError('unauthenticated', 'The current password is wrong', [
          { path: 'currentPassword', message: 'The current password is wrong' },
        ]),
        { status: 401, statusText: 'Unauthorized' },
      );
    await fixture.whenStable();
    expect(errors()).toEqual(['The current password is wrong']);
  });
});
