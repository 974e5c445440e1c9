import { Router, type Request, type RequestHandler, type Response } from 'express';

import type { SignedInResponse } from '@rampart/collab/api/accounts';
import type { Config } from '../../config';
import type { TeamRepository } from '../../data-access/repositories/team-repository';
import type { UserRecord } from '../../data-access/repositories/user-repository';
import type { AccessEvents } from '../../domain/access-events';
import type { AccountService } from '../../domain/account-service';
import { AppError } from '../../errors/app-error';
import { meResponse } from './dto';
import { publicOrigin } from './public-origin';
import { authRateLimit } from './rate-limits';
import {
  changePasswordBody,
  parseBody,
  registerBody,
  resetConfirmBody,
  resetRequestBody,
  signInBody,
} from './request-schemas';
import { requireUser, SESSION_COOKIE, signedInUser, type PassportInstance } from './session-auth';

export interface AuthRouterDeps {
  config: Config;
  accounts: AccountService;
  teams: TeamRepository;
  passport: PassportInstance;
  events: AccessEvents;
  csrfTokenFor: (req: Request) => string;
}

/**
 * `/api/auth/*`: register, sign in/out, who am I, CSRF token, password change and reset.
 * Sign-in and register regenerate the session (passport's `logIn`), so they answer with the new
 * session's CSRF token.
 */
export function authRouter(d: AuthRouterDeps): Router {
  const router = Router();
  const signInLimit = authRateLimit(d.config, 'sign-in');
  const registerLimit = authRateLimit(d.config, 'register');
  const resetLimit = authRateLimit(d.config, 'password-reset');

  const signedIn = async (req: Request, res: Response, user: UserRecord, status: number) => {
    await logIn(req, user);
    const body: SignedInResponse = {
      ...meResponse(user, await d.teams.listForUser(user.id)),
      csrfToken: d.csrfTokenFor(req),
    };
    // Also as a header, so an HTTP interceptor can follow every rotation the same way.
    res.set('x-csrf-token', body.csrfToken).status(status).json(body);
  };

  router.get('/csrf', (req, res) => {
    res.set('Cache-Control', 'no-store').json({ token: d.csrfTokenFor(req) });
  });

  router.post('/register', registerLimit, async (req, res) => {
    const body = parseBody(registerBody, req);
    const user = await d.accounts.register(body);
    await signedIn(req, res, user, 201);
  });

  router.post('/sign-in', signInLimit, async (req, res) => {
    // Validate first so the strategy only ever sees well-formed strings.
    parseBody(signInBody, req);
    const user = await authenticateLocal(d.passport, req, res);
    await signedIn(req, res, user, 200);
  });

  router.post('/sign-out', async (req, res) => {
    const userId = req.user?.id;
    await destroySession(req);
    res.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'lax', path: '/' });
    if (userId) d.events.emit('signedOut', userId);
    res.status(204).end();
  });

  router.get('/me', requireUser, async (req, res) => {
    const user = signedInUser(req);
    res.set('Cache-Control', 'no-store').json(meResponse(user, await d.teams.listForUser(user.id)));
  });

  router.post('/password', requireUser, async (req, res) => {
    const body = parseBody(changePasswordBody, req);
    const user = signedInUser(req);
    await d.accounts.changePassword(user.id, body.currentPassword, body.newPassword, req.sessionID);
    // A fresh session id too: whoever had a copy of the old cookie is out.
    await logIn(req, user);
    res.set('x-csrf-token', d.csrfTokenFor(req)).status(204).end();
  });

  router.post('/password-reset', resetLimit, async (req, res) => {
    const body = parseBody(resetRequestBody, req);
    await d.accounts.requestReset(body.email, publicOrigin(d.config, req));
    res.status(202).json({ message: 'If an account has this address, a reset link is on its way' });
  });

  router.post('/password-reset/confirm', resetLimit, async (req, res) => {
    const body = parseBody(resetConfirmBody, req);
    await d.accounts.confirmReset(body.token, body.password);
    res.status(204).end();
  });

  return router;
}

/** Runs passport-local with a callback, so failures go to the one error middleware. */
function authenticateLocal(
  auth: PassportInstance,
  req: Request,
  res: Response,
): Promise<UserRecord> {
  return new Promise((resolve, reject) => {
    const handler = auth.authenticate(
      'local',
      { session: false },
      (err: unknown, user: UserRecord | false | undefined) => {
        if (err) reject(err);
        else if (!user) reject(new AppError('unauthenticated', 'E-mail or password is wrong'));
        else resolve(user);
      },
    ) as RequestHandler;
    handler(req, res, (err?: unknown) => reject(err ?? new Error('passport did not answer')));
  });
}

/** passport's logIn: regenerates the session id (fixation defence) and stores the user id. */
function logIn(req: Request, user: UserRecord): Promise<void> {
  return new Promise((resolve, reject) =>
    req.logIn(user, (err) => (err ? reject(err) : resolve())),
  );
}

function destroySession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => {
    if (!req.session) return resolve();
    req.session.destroy((err) => (err ? reject(err) : resolve()));
  });
}
