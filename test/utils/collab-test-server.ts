import { createServer, type Server as HttpServer } from 'node:http';
import type { AddressInfo } from 'node:net';

import { Server as SocketServer } from 'socket.io';
import type { DataSource } from 'typeorm';

import type { Role } from '@rampart/collab/api/accounts';
import { MAX_PACKET_BYTES } from '@rampart/collab/sync/limits';

import type { CollabOptions } from '../../server/collab/collab-options';
import { attachCollab, type CollabRelay } from '../../server/collab/attach-collab';
import type { AccessChange, AccessEventSource } from '../../server/collab/collab-types';
import { openDatabase } from '../../server/data-access/data-source';
import type { PlanDocumentRepository } from '../../server/data-access/repositories/plan-document-repository';
import { silentLogger, type Logger } from '../../server/logger';

/**
 * Who may open which plan in a test: planId → userId → role. Kept outside the server so it
 * survives a restart. `everyone` grants a role to any user on any plan (two-process runs).
 */
export class AccessTable implements AccessEventSource {
  private readonly roles = new Map<string, Map<string, Role>>();
  private readonly listeners = new Set<(c: AccessChange) => void>();

  constructor(private readonly everyone: Role | null = null) {}

  grant(planId: string, userId: string, role: Role): void {
    if (!this.roles.has(planId)) this.roles.set(planId, new Map());
    this.roles.get(planId)!.set(userId, role);
    this.emit({ userId, planId });
  }

  revoke(planId: string, userId: string): void {
    this.roles.get(planId)?.delete(userId);
    this.emit({ userId, planId });
  }

  signOut(userId: string): void {
    this.emit({ userId, signedOut: true });
  }

  roleOf = async (userId: string, planId: string): Promise<Role | null> =>
    this.roles.get(planId)?.get(userId) ?? this.everyone;

  subscribe(listener: (c: AccessChange) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  private emit(change: AccessChange): void {
    for (const l of this.listeners) l(change);
  }
}

export interface CollabTestServer {
  url: string;
  port: number;
  relay: CollabRelay;
  io: SocketServer;
  httpServer: HttpServer;
  dataSource: DataSource;
  stop(): Promise<void>;
}

export interface CollabTestServerOptions {
  databaseUrl: string;
  access: AccessTable;
  /** Listen on this port (a restart keeps the clients' URL). @default 0 */
  port?: number;
  options?: Partial<CollabOptions>;
  /** Use the PostgreSQL adapter (several processes). */
  adapter?: boolean;
  /** Name of the adapter's pg connections, so a test can find and drop them. */
  adapterName?: string;
  repository?: (dataSource: DataSource) => PlanDocumentRepository;
  log?: Logger;
}

/**
 * The relay alone on a loopback port over a real database: socket.io with the same limits as
 * the application, authentication by the `testUser` query parameter (the session-based one is
 * tested with the full application), access from an `AccessTable`.
 */
export async function startCollabTestServer(o: CollabTestServerOptions): Promise<CollabTestServer> {
  const { dataSource } = await openDatabase(o.databaseUrl);
  const httpServer = createServer();
  const io = new SocketServer(httpServer, {
    serveClient: false,
    maxHttpBufferSize: MAX_PACKET_BYTES,
  });
  const relay = attachCollab(io, {
    dataSource,
    log: o.log ?? silentLogger,
    authorize: o.access.roleOf,
    authenticate: (req) => {
      const user = new URL(req.url ?? '/', 'http://localhost').searchParams.get('testUser');
      return user ? { id: user, name: `User ${user.slice(0, 8)}` } : null;
    },
    accessEvents: o.access,
    adapter: o.adapter
      ? { databaseUrl: o.databaseUrl, applicationName: o.adapterName ?? 'rampart-adapter' }
      : undefined,
    options: { antiEntropyMs: 1000, roomCloseDelayMs: 200, ...o.options },
    repository: o.repository?.(dataSource),
  });
  await new Promise<void>((resolve, reject) => {
    httpServer.once('error', reject);
    httpServer.listen(o.port ?? 0, '127.0.0.1', () => resolve());
  });
  const port = (httpServer.address() as AddressInfo).port;
  return {
    url: `http://127.0.0.1:${port}`,
    port,
    relay,
    io,
    httpServer,
    dataSource,
    stop: async () => {
      await new Promise<void>((r) => io.close(() => r()));
      await relay.close();
      await dataSource.destroy();
    },
  };
}

/** Inserts a plan catalogue row and returns its id. */
export async function createPlanRow(dataSource: DataSource, slug: string): Promise<string> {
  const rows = (await dataSource.query(
    `INSERT INTO "plans" ("slug", "name") VALUES ($1, $1) RETURNING "id"`,
    [slug],
  )) as Array<{ id: string }>;
  return rows[0]!.id;
}
