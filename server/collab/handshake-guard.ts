import type { IncomingMessage } from 'node:http';

import type { SyncError } from '@rampart/collab/sync/errors';

import type { Logger } from '../logger';
import type { Authenticate, CheckSession, PlanSocket } from './collab-types';

/** An `Error` socket.io passes to the client's `connect_error`, with a whitelisted code. */
export function handshakeError(error: SyncError): Error & { data: SyncError } {
  return Object.assign(new Error(error.message), { data: error });
}

/**
 * Whether the page that opened the socket may use it. CORS does not cover WebSocket, so the
 * `Origin` header is checked here: absent (non-browser clients; same-origin polling GETs) or
 * one of the allowed origins, by default the server's own host.
 */
export function isOriginAllowed(req: IncomingMessage, allowed: readonly string[]): boolean {
  const origin = req.headers.origin;
  if (origin === undefined) return true;
  if (allowed.includes(origin)) return true;
  const host = req.headers.host;
  return host !== undefined && (origin === `http://${host}` || origin === `https://${host}`);
}

/**
 * The namespace middleware: origin check, then the session's user (set on the request by the
 * session and passport middlewares the composition root applies to `io.engine`). Refused
 * sockets get a `connect_error` whose `data` names the reason.
 */
export function handshakeGuard(
  authenticate: Authenticate,
  allowedOrigins: readonly string[],
  log: Logger,
): (socket: PlanSocket, next: (err?: Error) => void) => void {
  return (socket, next) => {
    if (!isOriginAllowed(socket.request, allowedOrigins)) {
      log.warn(`[collab] socket refused: origin ${socket.request.headers.origin} not allowed`);
      next(
        handshakeError({ code: 'origin_denied', message: 'This page may not open a live plan.' }),
      );
      return;
    }
    Promise.resolve(authenticate(socket.request)).then(
      (user) => {
        if (!user) {
          next(handshakeError({ code: 'unauthenticated', message: 'Sign in to open live plans.' }));
          return;
        }
        socket.data.userId = user.id;
        socket.data.userName = user.name;
        next();
      },
      (err: unknown) => {
        log.error('[collab] authenticating a socket failed', err);
        next(handshakeError({ code: 'unavailable', message: 'Sign-in could not be checked.' }));
      },
    );
  };
}

interface SessionLike {
  reload(cb: (err?: unknown) => void): void;
  passport?: { user?: unknown };
}

/** The user passport put on the request, if any. */
export const passportUser: Authenticate = (req) => {
  const user = (req as IncomingMessage & { user?: { id?: unknown; name?: unknown } }).user;
  if (!user || typeof user.id !== 'string') return null;
  return { id: user.id, name: typeof user.name === 'string' ? user.name : '' };
};

/**
 * Reloads the express session from its store: a session destroyed by sign-out or expiry fails
 * to reload or has no passport user any more. A request without a session (injected
 * authentication in tests) counts as valid.
 */
export const reloadSession: CheckSession = (req) => {
  const session = (req as IncomingMessage & { session?: SessionLike }).session;
  if (!session || typeof session.reload !== 'function') return Promise.resolve(true);
  return new Promise((resolve) => {
    session.reload((err) => resolve(!err && session.passport?.user !== undefined));
  });
};
