/**
 * One relay server process for the two-process test: the relay with the PostgreSQL adapter on
 * `PORT`, every user an editor. Prints `READY <port>` when listening; SIGTERM stops it.
 * Environment: DATABASE_URL, PORT, ADAPTER_NAME, ANTI_ENTROPY_MS.
 */
import { consoleLogger } from '../../server/logger';
import { AccessTable, startCollabTestServer } from './collab-test-server';

async function main(): Promise<void> {
  const env = process.env;
  const server = await startCollabTestServer({
    databaseUrl: env['DATABASE_URL']!,
    access: new AccessTable('editor'),
    port: Number(env['PORT'] ?? 0),
    adapter: true,
    adapterName: env['ADAPTER_NAME'] ?? 'rampart-adapter',
    options: { antiEntropyMs: Number(env['ANTI_ENTROPY_MS'] ?? 1000) },
    log: consoleLogger,
  });
  process.stdout.write(`READY ${server.port}\n`);
  process.once('SIGTERM', () => {
    void server.stop().then(() => process.exit(0));
  });
}

main().catch((err: unknown) => {
  process.stderr.write(`collab process failed: ${String(err)}\n`);
  process.exit(1);
});
