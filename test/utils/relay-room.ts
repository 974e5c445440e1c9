/**
 * The usual set-up of a relay test file: a fresh database, the relay alone on a loopback port,
 * one plan row with the given roles, and test clients closed after the file. Registers jest's
 * `beforeAll`/`afterAll`, so call it at the top of a `describe`.
 */
import type { Role } from '@rampart/collab/api/accounts';

import type { CollabOptions } from '../../server/collab/collab-options';
import { TestPlanClient } from './collab-client';
import {
  AccessTable,
  createPlanRow,
  startCollabTestServer,
  type CollabTestServer,
} from './collab-test-server';
import { createTestDatabase, type TestDatabase } from './test-database';

export interface RelayRoom {
  readonly server: CollabTestServer;
  readonly planId: string;
  readonly access: AccessTable;
  /** Every client made by `client`, in order. */
  readonly clients: TestPlanClient[];
  /** A client of `user` for the room's plan (or `planId`), closed after the file. */
  client(user: string, planId?: string): TestPlanClient;
}

export function useRelayRoom(
  slug: string,
  roles: Record<string, Role>,
  options?: Partial<CollabOptions>,
): RelayRoom {
  const access = new AccessTable();
  const clients: TestPlanClient[] = [];
  let db: TestDatabase | undefined;
  let server: CollabTestServer | undefined;
  let planId: string | undefined;
  const ready = <T>(value: T | undefined, what: string): T => {
    if (value === undefined) throw new Error(`relay room ${slug}: ${what} used before beforeAll`);
    return value;
  };

  beforeAll(async () => {
    db = await createTestDatabase();
    server = await startCollabTestServer({ databaseUrl: db.url, access, options });
    planId = await createPlanRow(server.dataSource, slug);
    for (const [user, role] of Object.entries(roles)) access.grant(planId, user, role);
  });

  afterAll(async () => {
    for (const c of clients) c.close();
    await server?.stop();
    await db?.drop();
  });

  return {
    get server() {
      return ready(server, 'server');
    },
    get planId() {
      return ready(planId, 'planId');
    },
    access,
    clients,
    client(user: string, plan?: string): TestPlanClient {
      const c = new TestPlanClient(
        ready(server, 'server').url,
        user,
        plan ?? ready(planId, 'planId'),
      );
      clients.push(c);
      return c;
    },
  };
}
