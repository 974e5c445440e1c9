// Runs the server alone against an already running database (production-style entry point).
import { loadConfig } from './config';
import { consoleLogger } from './logger';
import { startServer } from './server';

async function main(): Promise<void> {
  const server = await startServer(loadConfig(), consoleLogger);
  consoleLogger.info(`Rampart listening on ${server.url}`);
  const shutdown = (): void => {
    consoleLogger.info('stopping');
    server.stop().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.once('SIGINT', shutdown);
  process.once('SIGTERM', shutdown);
}

main().catch((err: unknown) => {
  consoleLogger.error('Rampart failed to start', err);
  process.exit(1);
});
