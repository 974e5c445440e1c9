import { createAdapter } from '@socket.io/postgres-adapter';
import type { Router } from 'express';
import { Pool } from 'pg';
import type { Server as SocketServer } from 'socket.io';
import type { DataSource } from 'typeorm';

import { PLAN_NAMESPACE } from '@rampart/collab/sync/events';
import {
  encodeAwarenessBytes,
  encodeUpdate,
  toBytes,
  toWire,
} from '@rampart/collab/sync/wire-codec';

import { PlanDocumentRepository } from '../data-access/repositories/plan-document-repository';
import type { Logger } from '../logger';
import { DEFAULT_COLLAB_OPTIONS, type CollabOptions } from './collab-options';
import type {
  AccessEventSource,
  Authenticate,
  Authorize,
  CheckSession,
  PlanNamespace,
} from './collab-types';
import { handshakeGuard, passportUser, reloadSession } from './handshake-guard';
import { applyAccessChange, endSession } from './access-changes';
import { registerPlanHandlers, roomKey, type SocketSession } from './plan-socket-handlers';
import { RoomRegistry } from './room-registry';
import { PlanSnapshotRepository } from '../data-access/repositories/plan-snapshot-repository';
import { snapshotsRouter, type AssertPlanAccess } from './http/snapshots-router';
import { SnapshotService } from './snapshot-service';

/** What the relay is built from. Only `dataSource`, `log` and `authorize` are required. */
export interface CollabDeps {
  dataSource: DataSource;
  log: Logger;
  /** The user's effective role on a plan (the accounts policy), or null. */
  authorize: Authorize;
  /** @default passport's `req.user` (session + passport applied to `io.engine`) */
  authenticate?: Authenticate;
  /** @default reload the express session and require a passport user */
  checkSession?: CheckSession;
  /** Role changes, removals and sign-outs, applied to live sockets at once. */
  accessEvents?: AccessEventSource;
  /**
   * Use `@socket.io/postgres-adapter` on this database, so several server processes relay to
   * each other's clients. The relay owns the pool it opens. Without it: one process only.
   */
  adapter?: { databaseUrl: string; applicationName?: string };
  /** Enables the snapshot routes: resolves when the user may do the action, else throws 404/403. */
  assertPlan?: AssertPlanAccess;
  options?: Partial<CollabOptions>;
  /** @default a `PlanDocumentRepository` over `dataSource` (tests pass a slowed-down one) */
  repository?: PlanDocumentRepository;
}

/** The running relay. */
export interface CollabRelay {
  namespace: PlanNamespace;
  registry: RoomRegistry;
  repository: PlanDocumentRepository;
  /** `/:planId/snapshots…` routes (present when `assertPlan` was given); mount under `/api/plans`. */
  router: Router | null;
  snapshots: SnapshotService;
  /**
   * Stores and unloads every room, stops timers and the adapter's pool. Call after `io.close()`
   * (no more messages arrive; clients reconnect to the next server and re-sync) and before the
   * data source is destroyed.
   */
  close(): Promise<void>;
}

/**
 * Attaches the live-plan relay to `io`: the `/plans` namespace, handshake checks, rooms backed
 * by PostgreSQL, and (with `adapterPool`) the cross-process adapter.
 */
export function attachCollab(io: SocketServer, deps: CollabDeps): CollabRelay {
  const options: CollabOptions = { ...DEFAULT_COLLAB_OPTIONS, ...deps.options };
  const { log } = deps;
  const adapterPool = deps.adapter
    ? new Pool({
        connectionString: deps.adapter.databaseUrl,
        max: 4,
        application_name: deps.adapter.applicationName ?? 'rampart-relay-adapter',
      })
    : undefined;
  const multiProcess = adapterPool !== undefined;
  if (adapterPool) {
    // The adapter's listening client is checked out of the pool for good; without a listener
    // its 'error' (e.g. the connection killed) would crash the process instead of reconnecting.
    adapterPool.on('connect', (client) => {
      client.on('error', (err) => log.warn('[collab] adapter connection lost; reconnecting', err));
    });
    adapterPool.on('error', (err) => log.warn('[collab] adapter pool error', err));
    // The adapter applies to namespaces created after this call: `/plans` below.
    io.adapter(createAdapter(adapterPool, { tableName: 'socket_io_attachments' }));
  }
  const namespace: PlanNamespace = io.of(PLAN_NAMESPACE);
  const repository = deps.repository ?? new PlanDocumentRepository(deps.dataSource);
  const sessions = new Map<string, SocketSession>();

  const registry = new RoomRegistry(repository, options, log, {
    docUpdated(planId, update, except) {
      const op = namespace.local.to(roomKey(planId));
      (except ? op.except(except) : op).emit('plan:synced', planId, toWire(encodeUpdate(update)));
    },
    awarenessUpdated(planId, update, except, relayed) {
      const op = namespace.local.to(roomKey(planId));
      (except ? op.except(except) : op).emit(
        'plan:synced',
        planId,
        toWire(encodeAwarenessBytes(update)),
      );
      if (multiProcess && !relayed)
        namespace.serverSideEmit('plan:presence-relayed', planId, update);
    },
    stored(planId, update, seq) {
      if (multiProcess) namespace.serverSideEmit('plan:relayed', planId, update, seq);
    },
  });

  namespace.on('plan:relayed', (planId: unknown, update: unknown, seq: unknown) => {
    const bytes = toBytes(update);
    if (typeof planId === 'string' && bytes && typeof seq === 'number') {
      registry.relayed(planId, bytes, seq);
    }
  });
  namespace.on('plan:presence-relayed', (planId: unknown, update: unknown) => {
    const bytes = toBytes(update);
    if (typeof planId === 'string' && bytes) registry.presenceRelayed(planId, bytes);
  });

  namespace.use(handshakeGuard(deps.authenticate ?? passportUser, options.allowedOrigins, log));
  const handlerDeps = { registry, repo: repository, authorize: deps.authorize, options, log };
  namespace.on('connection', (socket) => {
    registerPlanHandlers(socket, handlerDeps, sessions);
  });

  const checkSession = deps.checkSession ?? reloadSession;
  const recheck = setInterval(() => {
    for (const session of sessions.values()) {
      checkSession(session.socket.request).then(
        (valid) => {
          if (!valid) endSession(session, log);
        },
        (err: unknown) => log.warn('[collab] session re-check failed; will retry', err),
      );
    }
  }, options.sessionRecheckMs);
  recheck.unref();

  const unsubscribe = deps.accessEvents?.subscribe((change) => {
    void applyAccessChange(change, sessions, registry, deps.authorize, log);
  });

  const snapshots = new SnapshotService(
    repository,
    new PlanSnapshotRepository(deps.dataSource),
    registry,
  );
  const router = deps.assertPlan
    ? snapshotsRouter({ snapshots, assertPlan: deps.assertPlan })
    : null;

  return {
    namespace,
    registry,
    repository,
    router,
    snapshots,
    close: async () => {
      clearInterval(recheck);
      unsubscribe?.();
      await registry.closeAll();
      if (adapterPool) await endAdapterPool(adapterPool, namespace, log);
    },
  };
}

/**
 * Ends the adapter's pool after `io.close()`. The adapter releases its LISTEN client when the
 * namespace closes, but a client it was still acquiring at that moment is set afterwards and
 * never released, and `pool.end()` would wait for it forever: close the adapter again until
 * every client is back (bounded), then end the pool.
 */
async function endAdapterPool(pool: Pool, namespace: PlanNamespace, log: Logger): Promise<void> {
  const deadline = Date.now() + 3_000;
  while (pool.totalCount > pool.idleCount && Date.now() < deadline) {
    namespace.adapter.close();
    await new Promise((r) => setTimeout(r, 50));
  }
  if (pool.totalCount > pool.idleCount) {
    log.warn('[collab] the adapter kept a database connection; ending its pool anyway');
  }
  await Promise.race([
    pool.end().catch(() => undefined),
    new Promise((r) => setTimeout(r, 2_000).unref()),
  ]);
}
