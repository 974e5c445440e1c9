import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { catchError, map, of } from 'rxjs';

import type { Role } from '@rampart/collab/api/accounts';

import { AuthSession } from './auth-session';
import { safeReturnUrl, signInUrlTree } from './return-url';

/** Route data key for `teamRoleGuard`: the team roles allowed on the route. */
export const ALLOWED_ROLES = 'allowedRoles';

/** Signed-in pages: waits for who-am-I, then lets in or sends to sign-in with a return URL. */
export const signedInGuard: CanActivateFn = (_route, state) => {
  const session = inject(AuthSession);
  const router = inject(Router);
  return session.ensureLoaded().pipe(
    map((me) => (me ? true : signInUrlTree(router, state.url))),
    // Server unreachable: still show sign-in rather than a blank page.
    catchError(() => of(signInUrlTree(router, state.url))),
  );
};

/**
 * Sign-in and register: a signed-in user goes straight on, to `?returnUrl=` (an invitation, say)
 * or else to their teams.
 */
export const signedOutGuard: CanActivateFn = (route) => {
  const session = inject(AuthSession);
  const router = inject(Router);
  return session.ensureLoaded().pipe(
    map((me) => (me ? router.parseUrl(safeReturnUrl(route.queryParamMap.get('returnUrl'))) : true)),
    catchError(() => of(true)),
  );
};

/**
 * Pages of one team (`:teamId` in the route): the caller must be a member with one of the roles
 * in `data.allowedRoles` (every role when absent). Anyone else goes to their team list, which
 * says why. The server checks the same again on every request; this guard only saves a trip
 * to a page whose requests would all be refused.
 */
export const teamRoleGuard: CanActivateFn = (route, state) => {
  const session = inject(AuthSession);
  const router = inject(Router);
  const teamId = route.paramMap.get('teamId') ?? '';
  const allowed = route.data[ALLOWED_ROLES] as readonly Role[] | undefined;
  return session.ensureLoaded().pipe(
    map((me) => {
      if (!me) return signInUrlTree(router, state.url);
      const membership = me.memberships.find((m) => m.teamId === teamId);
      if (membership && (!allowed || allowed.includes(membership.role))) return true;
      return router.createUrlTree(['/teams'], {
        queryParams: { denied: membership ? 'role' : 'team' },
      });
    }),
    catchError(() => of(signInUrlTree(router, state.url))),
  );
};
