import { createServer, type Server as HttpServer } from 'node:http';
import path from 'node:path';

import express, { type Express } from 'express';
import helmet from 'helmet';
import { Server as SocketServer } from 'socket.io';
import type { DataSource } from 'typeorm';

import type { Config } from './config';
import { probeDatabase } from './data-access/health-probe';
import { healthRouter } from './entry-points/http/health-router';
import { apiNotFound, errorHandler } from './errors/error-handler';
import type { Logger } from './logger';
import type { FakeSmtpServer } from './mail/fake-smtp';

/** What the composition root is built from; tests pass their own. */
export interface AppDeps {
  config: Config;
  dataSource: DataSource;
  log: Logger;
  /** Present outside production: the local fake mail server. */
  mailbox?: FakeSmtpServer;
  version: string;
}

export interface Application {
  app: Express;
  httpServer: HttpServer;
  io: SocketServer;
}

/** Largest JSON request body the API accepts. */
export const JSON_BODY_LIMIT = '256kb';

/**
 * Wires middlewares, API routes, the socket server and the built client. Holds no module-level
 * state: every call builds a fresh application (tests start several).
 */
export function createApplication(deps: AppDeps): Application {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'script-src': ["'self'"],
          // Angular injects component styles as <style> elements.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:'],
          'font-src': ["'self'"],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );

  const api = express.Router();
  api.use(express.json({ limit: JSON_BODY_LIMIT }));
  api.use(healthRouter({ probe: () => probeDatabase(deps.dataSource), version: deps.version }));
  api.use(apiNotFound);
  app.use('/api', api);

  serveClient(app, path.resolve(deps.config.CLIENT_DIR));
  app.use(errorHandler(deps.log));

  const httpServer = createServer(app);
  const io = new SocketServer(httpServer, { serveClient: false, maxHttpBufferSize: 1_000_000 });
  return { app, httpServer, io };
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
