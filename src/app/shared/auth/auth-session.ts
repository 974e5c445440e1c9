import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import {
  Observable,
  catchError,
  defer,
  finalize,
  map,
  of,
  shareReplay,
  switchMap,
  tap,
  throwError,
} from 'rxjs';

import type {
  ChangePasswordRequest,
  CredentialsRequest,
  MeResponse,
  MembershipDto,
  PasswordResetConfirmRequest,
  SignedInResponse,
  UserDto,
} from '@rampart/collab/api/accounts';

import { OfflineCopyRegistry } from '../plan-session/offline-copy-registry';
import { CsrfToken } from './csrf-token';

/** Whether we know who is signed in yet. */
export type SessionStatus = 'unknown' | 'signed-in' | 'signed-out';

/** Route the interceptor never turns into a redirect: a 401 there just means "signed out". */
export const ME_URL = '/api/auth/me';

/**
 * Who is signed in and in which teams, as signals for the shell, guards and pages; and the calls
 * that change it (register, sign in, sign out, passwords). Pages never call these routes directly.
 */
@Injectable({ providedIn: 'root' })
export class AuthSession {
  private readonly _http = inject(HttpClient);
  private readonly _csrf = inject(CsrfToken);
  private readonly _offlineCopies = inject(OfflineCopyRegistry);
  private readonly _me = signal<MeResponse | null>(null);
  private readonly _status = signal<SessionStatus>('unknown');
  private _loading$?: Observable<MeResponse | null>;

  /** `unknown` until the first `/api/auth/me` answer. */
  readonly status = this._status.asReadonly();
  /** The signed-in user, or null. */
  readonly user = computed<UserDto | null>(() => this._me()?.user ?? null);
  /** The user's teams with their role in each (empty when signed out). */
  readonly memberships = computed<readonly MembershipDto[]>(() => this._me()?.memberships ?? []);
  readonly isSignedIn = computed(() => this._status() === 'signed-in');

  /** The caller's membership of `teamId`, or undefined. */
  membership(teamId: string): MembershipDto | undefined {
    return this.memberships().find((m) => m.teamId === teamId);
  }

  /**
   * Resolves once who-am-I is known: at once when it already is, else one shared request.
   * Guards wait on this so a deep link does not bounce to sign-in before the answer arrives.
   */
  ensureLoaded(): Observable<MeResponse | null> {
    if (this._status() !== 'unknown') return of(this._me());
    return this.refresh();
  }

  /** Asks the server again (after joining or leaving a team, or a role change). */
  refresh(): Observable<MeResponse | null> {
    if (!this._loading$) {
      this._loading$ = this._http.get<MeResponse>(ME_URL).pipe(
        map((me) => this._accept(me)),
        catchError((err: unknown) => {
          if (err instanceof HttpErrorResponse && err.status === 401) {
            this._clear();
            return of(null);
          }
          return throwError(() => err);
        }),
        finalize(() => (this._loading$ = undefined)),
        shareReplay({ bufferSize: 1, refCount: true }),
      );
    }
    return this._loading$;
  }

  /**
   * `POST /api/auth/sign-in`. The server regenerates the session, which drops the old CSRF token;
   * the answer carries the new one.
   */
  signIn(email: string, password: string): Observable<MeResponse> {
    const body: CredentialsRequest = { email, password };
    return this._http.post<SignedInResponse>('/api/auth/sign-in', body).pipe(
      tap((res) => this._takeToken(res)),
      map((res) => this._accept(res)),
    );
  }

  /** `POST /api/auth/register` (signs the new user in, with a new session like sign-in). */
  register(email: string, password: string, name: string): Observable<MeResponse> {
    const body: CredentialsRequest = { email, password, name };
    return this._http.post<SignedInResponse>('/api/auth/register', body).pipe(
      tap((res) => this._takeToken(res)),
      map((res) => this._accept(res)),
    );
  }

  /**
   * Deletes this browser's offline copies of the user's plans (unsent edits in them are lost: ask
   * first, see `UserMenu`), then `POST /api/auth/sign-out`. The local state is cleared even if
   * the request fails.
   */
  signOut(): Observable<void> {
    const userId = this.user()?.id;
    const cleared = defer(() => (userId ? this._offlineCopies.clearUser(userId) : of([])));
    return cleared.pipe(
      // A copy that cannot be deleted must not keep the user signed in.
      catchError(() => of([])),
      switchMap(() => this._http.post<void>('/api/auth/sign-out', {})),
      finalize(() => {
        this._csrf.forget();
        this._clear();
      }),
    );
  }

  /**
   * `POST /api/auth/password` (signed in). The server regenerates the session and sends the new
   * CSRF token in the `x-csrf-token` response header, which the interceptor picks up.
   */
  changePassword(currentPassword: string, newPassword: string): Observable<void> {
    const body: ChangePasswordRequest = { currentPassword, newPassword };
    return this._http.post<void>('/api/auth/password', body);
  }

  /** `POST /api/auth/password-reset`: the server answers 202 whether or not the address exists. */
  requestPasswordReset(email: string): Observable<void> {
    return this._http.post<void>('/api/auth/password-reset', { email });
  }

  /** `POST /api/auth/password-reset/confirm` with the token from the e-mailed link. */
  confirmPasswordReset(token: string, password: string): Observable<void> {
    const body: PasswordResetConfirmRequest = { token, password };
    return this._http.post<void>('/api/auth/password-reset/confirm', body);
  }

  /**
   * Marks the session as ended without asking the server, for a 401 seen elsewhere (the session
   * expired or was destroyed in another tab).
   */
  markSignedOut(): void {
    this._csrf.forget();
    this._clear();
  }

  private _takeToken(res: Partial<SignedInResponse>): void {
    if (typeof res.csrfToken === 'string' && res.csrfToken) this._csrf.use(res.csrfToken);
    else this._csrf.forget();
  }

  private _accept(res: MeResponse): MeResponse {
    // Keep only the `MeResponse` part: the token must not linger in a signal.
    const me: MeResponse = { user: res.user, memberships: res.memberships };
    this._me.set(me);
    this._status.set('signed-in');
    return me;
  }

  private _clear(): void {
    this._me.set(null);
    this._status.set('signed-out');
  }
}
