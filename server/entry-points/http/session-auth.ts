import type { RequestHandler } from 'express';
import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import { csrfSync } from 'csrf-sync';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';

import type { Config } from '../../config';
import type { UserRecord, UserRepository } from '../../data-access/repositories/user-repository';
import type { AccountService } from '../../domain/account-service';
import { AppError } from '../../errors/app-error';

/** A passport instance (the type of `new passport.Authenticator()`). */
export type PassportInstance = InstanceType<typeof passport.Authenticator>;

/** Name of the session cookie. */
export const SESSION_COOKIE = 'rampart.sid';

/** A session store plus the middleware that uses it. */
export interface SessionSetup {
  middleware: RequestHandler;
  store: session.Store & { close(): void | Promise<void> };
}

/**
 * express-session stored in PostgreSQL (connect-pg-simple, table `sessions` from our migration).
 * Queries go through the TypeORM data source, so no second pool is opened and a re-initialized
 * data source is picked up. The cookie is httpOnly, SameSite=Lax, and Secure when the request
 * came over TLS (`secure: 'auto'` with the app's `trust proxy`).
 */
export function createSessionSetup(config: Config, dataSource: DataSource): SessionSetup {
  const PgStore = connectPgSimple(session);
  const store: SessionSetup['store'] = new PgStore({
    pgPromise: { any: (query: string, params: unknown[]) => dataSource.query(query, params) },
    tableName: 'sessions',
    createTableIfMissing: false,
    pruneSessionInterval: 15 * 60,
  });
  const middleware = session({
    name: SESSION_COOKIE,
    secret: config.SESSION_SECRET,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: false,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: 'auto',
      maxAge: config.SESSION_MAX_AGE_HOURS * 3_600_000,
    },
  });
  return { middleware, store };
}

/**
 * A passport instance of its own (no module-level state): the local strategy checks e-mail and
 * password through the account service; the session keeps only the user id.
 */
export function createPassport(accounts: AccountService, users: UserRepository): PassportInstance {
  const auth = new passport.Authenticator();
  auth.use(
    new LocalStrategy(
      { usernameField: 'email', passwordField: 'password' },
      (email, password, done) => {
        accounts.verifyCredentials(email, password).then(
          (user) => done(null, user),
          (err: unknown) => done(err),
        );
      },
    ),
  );
  auth.serializeUser((user, done) => done(null, user.id));
  auth.deserializeUser((id: string, done) => {
    // A deleted account simply is not signed in any more (false), rather than an error.
    users.findById(id).then(
      (user) => done(null, user ?? false),
      (err: unknown) => done(err),
    );
  });
  return auth;
}

/**
 * CSRF protection with synchronizer tokens kept in the session (csrf-sync); the token travels
 * in the `x-csrf-token` header. A refused request gets 403 `csrf_invalid` in the API's shape.
 */
export function createCsrf(): {
  protect: RequestHandler;
  tokenFor: (req: Express.Request) => string;
} {
  const { generateToken, isRequestValid } = csrfSync({
    getTokenFromRequest: (req) => {
      const h = req.headers['x-csrf-token'];
      return typeof h === 'string' ? h : undefined;
    },
  });
  const safe = new Set(['GET', 'HEAD', 'OPTIONS']);
  const protect: RequestHandler = (req, _res, next) => {
    if (safe.has(req.method) || isRequestValid(req)) return next();
    next(
      new AppError(
        'csrf_invalid',
        'Missing or invalid CSRF token: get one from GET /api/auth/csrf and send it in the x-csrf-token header',
      ),
    );
  };
  return {
    protect,
    tokenFor: (req) => generateToken(req as Parameters<typeof generateToken>[0]),
  };
}

/** 401 unless signed in; later handlers can rely on `signedInUser(req)`. */
export const requireUser: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : new AppError('unauthenticated', 'Sign in first'));
};

/** The signed-in user (call only behind `requireUser`). */
export function signedInUser(req: Express.Request): UserRecord {
  if (!req.user) throw new AppError('unauthenticated', 'Sign in first');
  return req.user;
}
