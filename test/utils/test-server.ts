import path from 'node:path';

import { loadConfig } from '../../server/config';
import { silentLogger } from '../../server/logger';
import { startServer, type RunningServer } from '../../server/server';
import { createTestDatabase, type TestDatabase } from './test-database';

export interface TestServer extends RunningServer {
  database: TestDatabase;
}

/**
 * The real server in-process on a free loopback port, with its own fresh database and fake
 * SMTP server. `stop()` tears everything down, the database included.
 */
export async function startTestServer(env: Record<string, string> = {}): Promise<TestServer> {
  const database = await createTestDatabase();
  const config = loadConfig({
    NODE_ENV: 'test',
    PORT: '0',
    SMTP_PORT: '0',
    DATABASE_URL: database.url,
    CLIENT_DIR: path.resolve(__dirname, '../../dist/web/browser'),
    ...env,
  });
  try {
    const server = await startServer(config, silentLogger);
    return {
      ...server,
      database,
      stop: async () => {
        await server.stop();
        await database.drop();
      },
    };
  } catch (err) {
    await database.drop();
    throw err;
  }
}
