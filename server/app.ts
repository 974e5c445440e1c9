import { createServer, type IncomingMessage, type Server as HttpServer } from 'node:http';
import path from 'node:path';

import express, { type Express, type RequestHandler } from 'express';
import helmet from 'helmet';
import { Server as SocketServer } from 'socket.io';
import type { DataSource } from 'typeorm';

import { MAX_PACKET_BYTES } from '@rampart/collab/sync/limits';

import { accessEventSource } from './collab/access-event-source';
import { attachCollab, type CollabRelay } from './collab/attach-collab';
import type { Config } from './config';
import { probeDatabase } from './data-access/health-probe';
import { AccessEvents, userRoom } from './domain/access-events';
import type { AccessService } from './domain/access-service';
import { createAccountsContext } from './domain/accounts-context';
import { authRouter } from './entry-points/http/auth-router';
import { healthRouter } from './entry-points/http/health-router';
import { invitationsRouter } from './entry-points/http/invitations-router';
import { plansRouter } from './entry-points/http/plans-router';
import {
  createCsrf,
  createPassport,
  createSessionSetup,
  type PassportInstance,
} from './entry-points/http/session-auth';
import { teamsRouter } from './entry-points/http/teams-router';
import { apiNotFound, errorHandler } from './errors/error-handler';
import type { Logger } from './logger';
import type { FakeSmtpServer } from './mail/fake-smtp';
import { mailboxRouter } from './mail/mailbox-router';
import { DiscardingMailer, SmtpMailer, type Mailer } from './mail/mailer';

/** What the composition root is built from; tests pass their own. */
export interface AppDeps {
  config: Config;
  dataSource: DataSource;
  log: Logger;
  /** Present outside production: the local fake mail server (mail goes there, `/dev/mailbox`). */
  mailbox?: FakeSmtpServer;
  /** Sends mail. @default SMTP to `mailbox` when present, else a mailer that drops mail */
  mailer?: Mailer;
  /** Access-change notifications. @default a fresh `AccessEvents` */
  events?: AccessEvents;
  version: string;
}

export interface Application {
  app: Express;
  httpServer: HttpServer;
  io: SocketServer;
  /** The session middleware (also applied to `io.engine`). */
  sessionMiddleware: RequestHandler;
  /** This application's passport (also applied to `io.engine`). */
  passport: PassportInstance;
  /** Sign-out, role and membership changes, for live connections. */
  events: AccessEvents;
  /** Role lookups through the one policy (`effectivePlanRole`, `assertPlan`…). */
  access: AccessService;
  /** The live-plan relay (rooms, snapshots). */
  collab: CollabRelay;
  /** Releases what the application holds besides the HTTP server (session store timers, SMTP). */
  close(): Promise<void>;
}

/** Largest JSON request body the API accepts. */
export const JSON_BODY_LIMIT = '256kb';

/**
 * Wires middlewares, API routes, the socket server and the built client. Holds no module-level
 * state: every call builds a fresh application (tests start several).
 */
export function createApplication(deps: AppDeps): Application {
  const { config, log } = deps;
  const events = deps.events ?? new AccessEvents();
  const smtp = deps.mailbox
    ? new SmtpMailer({ host: '127.0.0.1', port: deps.mailbox.port }, config.MAIL_FROM)
    : undefined;
  const mailer =
    deps.mailer ??
    smtp ??
    new DiscardingMailer((m) =>
      log.warn(`[mail] no mail server configured; dropped "${m.subject}"`),
    );
  const ctx = createAccountsContext({ config, dataSource: deps.dataSource, mailer, events });
  const sessions = createSessionSetup(config, deps.dataSource);
  const passport = createPassport(ctx.accounts, ctx.users);
  const csrf = createCsrf();

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(helmet({ contentSecurityPolicy: { useDefaults: true, directives: CSP } }));

  const api = express.Router();
  api.use(express.json({ limit: JSON_BODY_LIMIT }));
  api.use(sessions.middleware, passport.initialize(), passport.session());
  api.use(healthRouter({ probe: () => probeDatabase(deps.dataSource), version: deps.version }));
  api.use(csrf.protect);
  api.use(
    '/auth',
    authRouter({
      config,
      accounts: ctx.accounts,
      teams: ctx.teamRecords,
      passport,
      events,
      csrfTokenFor: csrf.tokenFor,
    }),
  );
  api.use('/teams', teamsRouter({ config, teams: ctx.teams, invitations: ctx.invitations }));
  api.use('/invitations', invitationsRouter({ invitations: ctx.invitations, teams: ctx.teams }));
  api.use('/plans', plansRouter({ plans: ctx.plans }));
  // Snapshot routes of the live-plan relay, filled in once the socket server exists (below).
  const collabApi = express.Router();
  api.use('/plans', collabApi);
  api.use(apiNotFound);
  app.use('/api', api);

  if (deps.mailbox && config.NODE_ENV !== 'production')
    app.use('/dev', mailboxRouter(deps.mailbox));

  serveClient(app, path.resolve(config.CLIENT_DIR));
  app.use(errorHandler(log));

  const httpServer = createServer(app);
  const io = new SocketServer(httpServer, {
    serveClient: false,
    maxHttpBufferSize: MAX_PACKET_BYTES,
  });
  // The session and passport on the engine.io handshake request only (later polling requests of
  // the same connection carry `sid` and need neither), so `socket.request.user` is the user.
  io.engine.use(onlyForHandshake(sessions.middleware));
  io.engine.use(onlyForHandshake(passport.initialize()));
  io.engine.use(onlyForHandshake(passport.session()));
  io.on('connection', (socket) => {
    const user = (socket.request as IncomingMessage & { user?: Express.User }).user;
    if (user) void socket.join(userRoom(user.id));
  });
  events.on('signedOut', (userId) => {
    io.in(userRoom(userId)).disconnectSockets(true);
  });
  const collab = attachCollab(io, {
    dataSource: deps.dataSource,
    log,
    authorize: (userId, planId) => ctx.access.effectivePlanRole(userId, planId),
    assertPlan: (userId, planId, action) => ctx.access.assertPlan(userId, planId, action),
    accessEvents: accessEventSource(events),
    adapter: { databaseUrl: config.DATABASE_URL },
  });
  if (collab.router) collabApi.use(collab.router);

  return {
    app,
    httpServer,
    io,
    sessionMiddleware: sessions.middleware,
    passport,
    events,
    access: ctx.access,
    collab,
    close: async () => {
      // First: the relay stores what its rooms hold while the database is still open.
      await collab.close();
      await sessions.store.close();
      smtp?.close();
    },
  };
}

const CSP = {
  'script-src': ["'self'"],
  // Angular injects component styles as <style> elements.
  'style-src': ["'self'", "'unsafe-inline'"],
  'img-src': ["'self'", 'data:'],
  'font-src': ["'self'"],
  'connect-src': ["'self'"],
  'upgrade-insecure-requests': null,
};

/** Runs an Express middleware on engine.io's handshake request only. */
function onlyForHandshake(middleware: RequestHandler) {
  return (
    req: IncomingMessage & { _query?: Record<string, string> },
    res: unknown,
    next: (err?: unknown) => void,
  ) => {
    if (req._query?.['sid'] === undefined) {
      (middleware as unknown as (q: unknown, s: unknown, n: (err?: unknown) => void) => void)(
        req,
        res,
        next,
      );
    } else {
      next();
    }
  };
}

/** Static files of the built client, and index.html for every other GET (client-side routes). */
function serveClient(app: Express, dir: string): void {
  app.use(express.static(dir, { index: false, maxAge: '1h' }));
  app.get('/{*splat}', (_req, res, next) => {
    res.set('Cache-Control', 'no-cache');
    res.sendFile(path.join(dir, 'index.html'), (err) => {
      if (err) {
        res
          .status(503)
          .type('text/plain')
          .send(
            'The Rampart client is not built. Run `npm start` (it builds it) or `npx ng build`.',
          );
        next();
      }
    });
  });
}
