import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map, of, shareReplay } from 'rxjs';

import type { CsrfResponse } from '@rampart/collab/api/accounts';

/** Route that hands out the CSRF token bound to the current session. */
export const CSRF_URL = '/api/auth/csrf';

/** Header the server reads the token from on every state-changing request. */
export const CSRF_HEADER = 'x-csrf-token';

/**
 * The session's CSRF token, fetched once and shared by every request until replaced. The token
 * belongs to the session, and the server regenerates the session at sign-in, register, password
 * change and sign-out: it hands the new token back (in the sign-in body or the `x-csrf-token`
 * response header), and `AuthSession` and the interceptor `use()` it, or `forget()` it.
 */
@Injectable({ providedIn: 'root' })
export class CsrfToken {
  private readonly _http = inject(HttpClient);
  private _token$?: Observable<string>;

  /** The token, from cache or from one request shared by all callers waiting for it. */
  get(): Observable<string> {
    if (!this._token$) {
      const request = this._http.get<CsrfResponse>(CSRF_URL).pipe(
        map((body) => {
          if (typeof body?.token !== 'string' || body.token === '') {
            throw new Error(`${CSRF_URL} answered without a token`);
          }
          return body.token;
        }),
        shareReplay({ bufferSize: 1, refCount: false }),
      );
      this._token$ = request;
      // A failed fetch must not stay cached: the next request asks again.
      request.subscribe({
        error: () => {
          if (this._token$ === request) this._token$ = undefined;
        },
      });
    }
    return this._token$;
  }

  /** Uses `token` from now on (the server rotated it and said so). */
  use(token: string): void {
    this._token$ = of(token);
  }

  /** Drops the cached token; the next state-changing request fetches a fresh one. */
  forget(): void {
    this._token$ = undefined;
  }
}
