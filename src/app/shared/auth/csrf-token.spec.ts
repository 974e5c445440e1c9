import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';

import { CSRF_URL, CsrfToken } from './csrf-token';

describe('CsrfToken', () => {
  let csrf: CsrfToken;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    csrf = TestBed.inject(CsrfToken);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('get() twice → one request, both callers get the token', async () => {
    const a = firstValueFrom(csrf.get());
    const b = firstValueFrom(csrf.get());
    http.expectOne(CSRF_URL).flush({ token: 'tok-1' });
    expect(await a).toBe('tok-1');
    expect(await b).toBe('tok-1');
    expect(await firstValueFrom(csrf.get())).toBe('tok-1');
  });

  it('forget() then get() → a new request and the new token', async () => {
    const first = firstValueFrom(csrf.get());
    http.expectOne(CSRF_URL).flush({ token: 'tok-1' });
    await first;
    csrf.forget();
    const second = firstValueFrom(csrf.get());
    http.expectOne(CSRF_URL).flush({ token: 'tok-2' });
    expect(await second).toBe('tok-2');
  });

  it('failed fetch → error, and the next get() asks again', async () => {
    const failed = firstValueFrom(csrf.get());
    http.expectOne(CSRF_URL).flush(null, { status: 500, statusText: 'Server Error' });
    await expect(failed).rejects.toBeDefined();
    const retry = firstValueFrom(csrf.get());
    http.expectOne(CSRF_URL).flush({ token: 'tok-3' });
    expect(await retry).toBe('tok-3');
  });

  it('answer without a token → error naming the route', async () => {
    const result = firstValueFrom(csrf.get());
    http.expectOne(CSRF_URL).flush({});
    await expect(result).rejects.toThrow(`${CSRF_URL} answered without a token`);
  });
});
