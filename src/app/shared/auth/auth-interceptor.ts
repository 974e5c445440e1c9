import {
  HttpErrorResponse,
  HttpEvent,
  HttpHandlerFn,
  HttpInterceptorFn,
  HttpRequest,
  HttpResponse,
} from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { Observable, catchError, switchMap, tap, throwError } from 'rxjs';

import { parseErrorBody } from '../api/api-error';
import { AuthSession, ME_URL } from './auth-session';
import { CSRF_HEADER, CsrfToken } from './csrf-token';
import { signInUrlTree } from './return-url';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * 401s that are answers, not lost sessions: wrong credentials at sign-in, or a wrong current
 * password. Redirecting there would wipe what the user typed.
 */
const ANSWER_401_URLS = new Set([ME_URL, '/api/auth/sign-in', '/api/auth/password']);

/**
 * Adds the session's CSRF token to every state-changing API request, takes a rotated token from
 * an `x-csrf-token` response header (password change), retries once with a fresh token when the
 * server says the token is stale (`csrf_invalid`, e.g. the session expired), and turns a 401 on
 * an ordinary route into a trip to sign-in that comes back to where the user was.
 */
export const authInterceptor: HttpInterceptorFn = (req, next) => {
  if (!isApi(req.url)) return next(req);
  const csrf = inject(CsrfToken);
  const session = inject(AuthSession);
  const router = inject(Router);

  const send = (): Observable<HttpEvent<unknown>> =>
    needsToken(req) ? withToken(req, next, csrf) : next(req);

  return send().pipe(
    tap((event) => {
      const rotated = event instanceof HttpResponse ? event.headers.get(CSRF_HEADER) : null;
      if (rotated) csrf.use(rotated);
    }),
    catchError((err: unknown) => {
      if (!(err instanceof HttpErrorResponse)) return throwError(() => err);
      if (err.status === 403 && parseErrorBody(err.error)?.error.code === 'csrf_invalid') {
        csrf.forget();
        return withToken(req, next, csrf);
      }
      return throwError(() => err);
    }),
    catchError((err: unknown) => {
      if (
        err instanceof HttpErrorResponse &&
        err.status === 401 &&
        !ANSWER_401_URLS.has(path(req.url))
      ) {
        session.markSignedOut();
        void router.navigateByUrl(signInUrlTree(router, router.url));
      }
      return throwError(() => err);
    }),
  );
};

function withToken(
  req: HttpRequest<unknown>,
  next: HttpHandlerFn,
  csrf: CsrfToken,
): Observable<HttpEvent<unknown>> {
  return csrf
    .get()
    .pipe(switchMap((token) => next(req.clone({ setHeaders: { [CSRF_HEADER]: token } }))));
}

function needsToken(req: HttpRequest<unknown>): boolean {
  return !SAFE_METHODS.has(req.method.toUpperCase());
}

function isApi(url: string): boolean {
  return path(url).startsWith('/api/');
}

/** The path of a relative or same-origin absolute URL, without query or hash. */
function path(url: string): string {
  const noOrigin = url.replace(/^https?:\/\/[^/]+/, '');
  return noOrigin.split(/[?#]/, 1)[0] ?? '';
}
