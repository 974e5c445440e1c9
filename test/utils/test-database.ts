import { randomBytes } from 'node:crypto';

import { Client } from 'pg';

/** A fresh, empty database in the throwaway cluster `npm test` started. */
export interface TestDatabase {
  url: string;
  name: string;
  drop(): Promise<void>;
}

function adminUrl(): URL {
  const url = process.env['TEST_DATABASE_URL'];
  if (!url) {
    throw new Error(
      'TEST_DATABASE_URL is not set: run the server and browser tests through `npm test`, ' +
        'which starts a throwaway PostgreSQL cluster.',
    );
  }
  return new URL(url);
}

/** Creates a uniquely named database so every test file gets its own schema. */
export async function createTestDatabase(): Promise<TestDatabase> {
  const admin = adminUrl();
  const name = `t_${randomBytes(6).toString('hex')}`;
  const client = new Client({ connectionString: admin.toString() });
  await client.connect();
  try {
    await client.query(`CREATE DATABASE ${name}`);
  } finally {
    await client.end();
  }
  const url = new URL(admin.toString());
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    name,
    drop: async () => {
      const c = new Client({ connectionString: admin.toString() });
      await c.connect();
      try {
        await c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      } finally {
        await c.end();
      }
    },
  };
}
