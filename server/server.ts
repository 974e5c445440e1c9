import type { AddressInfo } from 'node:net';

import type { DataSource } from 'typeorm';

import packageJson from '../package.json';
import { createApplication, type Application } from './app';
import type { Config } from './config';
import { openDatabase } from './data-access/data-source';
import { seedDemo } from './data-access/seed';
import type { Logger } from './logger';
import { FakeSmtpServer } from './mail/fake-smtp';

/** A running Rampart server. */
export interface RunningServer extends Application {
  url: string;
  port: number;
  dataSource: DataSource;
  mailbox?: FakeSmtpServer;
  stop(): Promise<void>;
}

/** The version shown by /api/health. */
const VERSION: string = packageJson.version;

/**
 * Database → migrations → demo data → fake SMTP (outside production) → HTTP + sockets.
 * Each step's failure stops what the earlier steps started.
 */
export async function startServer(config: Config, log: Logger): Promise<RunningServer> {
  const { dataSource, applied } = await openDatabase(config.DATABASE_URL);
  const cleanups: Array<() => Promise<unknown>> = [() => dataSource.destroy()];
  try {
    if (applied.length) log.info(`[db] applied migrations: ${applied.join(', ')}`);
    if (config.SEED_DEMO) {
      const { created } = await seedDemo(dataSource, { bcryptCost: config.BCRYPT_COST });
      log.info(
        created.length
          ? `[seed] created ${created.join(', ')}`
          : '[seed] demo data already present',
      );
    }
    let mailbox: FakeSmtpServer | undefined;
    if (config.NODE_ENV !== 'production') {
      mailbox = new FakeSmtpServer();
      const smtpPort = await mailbox.start(config.SMTP_PORT);
      cleanups.unshift(() => mailbox!.stop());
      log.info(`[mail] fake SMTP server on 127.0.0.1:${smtpPort}`);
    }
    const application = createApplication({ config, dataSource, log, mailbox, version: VERSION });
    await new Promise<void>((resolve, reject) => {
      application.httpServer.once('error', reject);
      application.httpServer.listen(config.PORT, config.HOST, () => resolve());
    });
    const port = (application.httpServer.address() as AddressInfo).port;
    const stop = async (): Promise<void> => {
      await new Promise<void>((resolve) => {
        application.io.close(() => resolve());
      });
      await application.close();
      for (const cleanup of cleanups) await cleanup();
    };
    return {
      ...application,
      url: `http://${config.HOST}:${port}`,
      port,
      dataSource,
      mailbox,
      stop,
    };
  } catch (err) {
    for (const cleanup of cleanups) await cleanup().catch(() => undefined);
    throw err;
  }
}
