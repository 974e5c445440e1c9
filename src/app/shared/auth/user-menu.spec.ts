import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import { meAs } from '../../testing/account-fixtures';
import { AuthSession, ME_URL } from './auth-session';
import { UserMenu } from './user-menu';

describe('UserMenu', () => {
  it('shows the name; Sign out → POST sign-out, signed out, /sign-in with a notice', async () => {
    TestBed.configureTestingModule({
      imports: [UserMenu],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    const http = TestBed.inject(HttpTestingController);
    const session = TestBed.inject(AuthSession);
    const loaded = firstValueFrom(session.ensureLoaded());
    http.expectOne(ME_URL).flush(meAs('reviewer'));
    await loaded;
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);

    const fixture = TestBed.createComponent(UserMenu);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const trigger = el.querySelector<HTMLButtonElement>('[data-testid=user-menu]')!;
    expect(trigger.textContent).toContain('Reviewer Example');
    trigger.click();
    await fixture.whenStable();
    const items = [...document.querySelectorAll<HTMLElement>('[mat-menu-item]')];
    expect(items.map((i) => i.textContent?.replace(/\s+/g, ' ').trim())).toEqual([
      'groups Your teams',
      'key Change password',
      'logout Sign out',
    ]);
    items[2].click();
    http.expectOne('/api/auth/sign-out').flush(null, { status: 204, statusText: 'No Content' });
    expect(session.status()).toBe('signed-out');
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { notice: 'signed-out' } });
    http.verify();
  });
});
