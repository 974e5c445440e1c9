import { Router, UrlTree } from '@angular/router';

/**
 * Where to go after signing in. Only a path on this site is accepted (`/x`, not `//host` or
 * `https://…`), so a crafted link cannot send the user elsewhere after they type a password.
 */
export function safeReturnUrl(value: string | null | undefined, fallback = '/teams'): string {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) {
    return fallback;
  }
  // Coming back to an auth page would loop.
  if (/^\/(sign-in|register)(\?|$)/.test(value)) return fallback;
  return value;
}

/** `/sign-in?returnUrl=<from>`, omitting the parameter when there is nothing to come back to. */
export function signInUrlTree(router: Router, from: string): UrlTree {
  const returnUrl = safeReturnUrl(from, '');
  return router.createUrlTree(['/sign-in'], returnUrl ? { queryParams: { returnUrl } } : {});
}
