import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { MeResponse } from '@rampart/collab/api/accounts';

import { AuthSession, ME_URL } from '../../shared/auth/auth-session';
import { meAs } from '../../testing/account-fixtures';
import { Teams } from './teams';

describe('Teams page', () => {
  let http: HttpTestingController;

  async function render(me: MeResponse, denied?: string) {
    TestBed.configureTestingModule({
      imports: [Teams],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    const loaded = firstValueFrom(TestBed.inject(AuthSession).ensureLoaded());
    http.expectOne(ME_URL).flush(me);
    await loaded;
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const fixture = TestBed.createComponent(Teams);
    if (denied) fixture.componentRef.setInput('denied', denied);
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement, navigate };
  }

  afterEach(() => http.verify());

  it('two memberships → two links sorted by team name, with the role', async () => {
    const { el } = await render(meAs('editor'));
    const links = [...el.querySelectorAll<HTMLAnchorElement>('a[href^="/teams/"]')];
    const title = (a: Element) => a.querySelector('[matListItemTitle]')?.textContent?.trim();
    const line = (a: Element) => a.querySelector('[matListItemLine]')?.textContent?.trim();
    expect(links.map((a) => [title(a), line(a)])).toEqual([
      ['Bench fixtures', 'Viewer'],
      ['Motor-drive controller', 'Editor'],
    ]);
  });

  it('no memberships → the empty state explaining how to join', async () => {
    const { el } = await render({ user: meAs('viewer').user, memberships: [] });
    expect(el.querySelector('[data-testid=no-teams]')?.textContent).toContain('invitation link');
  });

  it('?denied=team → says the user is not a member', async () => {
    const { el } = await render(meAs('viewer'), 'team');
    expect(el.querySelector('[data-testid=denied]')?.textContent).toContain('not a member');
  });

  it('create a team → POST, who-am-I again, then the new team page', async () => {
    const { fixture, el, navigate } = await render(meAs('viewer'));
    const input = el.querySelector<HTMLInputElement>('[formcontrolname=name]')!;
    input.value = 'Motor-drive rev B';
    input.dispatchEvent(new Event('input'));
    el.querySelector('form')!.dispatchEvent(new Event('submit'));
    await fixture.whenStable();
    const req = http.expectOne('/api/teams');
    expect(req.request.body).toEqual({ name: 'Motor-drive rev B' });
    req.flush({ id: 'team-new', name: 'Motor-drive rev B', role: 'owner' });
    http.expectOne(ME_URL).flush(meAs('viewer'));
    expect(navigate).toHaveBeenCalledWith(['/teams', 'team-new']);
  });
});
