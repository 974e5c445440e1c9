// `npm start`: private PostgreSQL up → client built (production) → server (migrations, demo data,
// fake SMTP, HTTP) on loopback. Ctrl-C (SIGINT) or SIGTERM stops the server and the database.
import { spawn } from 'node:child_process';
import path from 'node:path';

import { loadConfig } from './config';
import { DEMO_SIGN_IN } from './data-access/seed';
import { consoleLogger as log } from './logger';
import { startServer, type RunningServer } from './server';

const root = path.resolve(__dirname, '..');
let server: RunningServer | undefined;
let stopping = false;
let databaseStarted = false;

function run(command: string, args: string[]): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { cwd: root, stdio: 'inherit' });
    child.once('error', reject);
    child.once('exit', (code, signal) =>
      code === 0
        ? resolve()
        : reject(new Error(`${path.basename(args[0] ?? command)} exited with ${code ?? signal}`)),
    );
  });
}

async function shutdown(code: number): Promise<never> {
  if (stopping) process.exit(code);
  stopping = true;
  log.info('stopping Rampart…');
  try {
    await server?.stop();
  } catch (err) {
    log.error('server did not stop cleanly', err);
  }
  if (databaseStarted) {
    await run('bash', ['server/db/pg.sh', 'stop']).catch((err: unknown) =>
      log.error('database stop failed', err),
    );
  }
  process.exit(code);
}

async function main(): Promise<void> {
  process.once('SIGINT', () => void shutdown(0));
  process.once('SIGTERM', () => void shutdown(0));
  const config = loadConfig();

  databaseStarted = true;
  await run('bash', ['server/db/pg.sh', 'start']);
  if (stopping) return;
  log.info('building the client (production)…');
  await run(process.execPath, [
    'node_modules/@angular/cli/bin/ng.js',
    'build',
    '--configuration',
    'production',
  ]);
  if (stopping) return;

  server = await startServer(config, log);
  log.info('');
  log.info(`Rampart is up: ${server.url}/`);
  if (config.SEED_DEMO) for (const line of DEMO_SIGN_IN) log.info(`  ${line}`);
  if (server.mailbox) log.info(`  mailbox (development only): ${server.url}/dev/mailbox`);
  log.info('Press Ctrl-C to stop the server and the database.');
}

main().catch(async (err: unknown) => {
  log.error('Rampart failed to start', err instanceof Error ? err.message : err);
  await shutdown(1);
});
