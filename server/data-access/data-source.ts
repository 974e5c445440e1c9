import 'reflect-metadata';
import { DataSource } from 'typeorm';

import { entities } from './entities';
import { migrations } from './migrations';

/** A PostgreSQL data source for `url`. Schema changes come only from migrations. */
export function createDataSource(url: string): DataSource {
  return new DataSource({
    type: 'postgres',
    url,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    logging: ['error'],
    extra: { max: 10, connectionTimeoutMillis: 5_000 },
  });
}

/** Opens the data source and applies pending migrations; returns their names. */
export async function openDatabase(
  url: string,
): Promise<{ dataSource: DataSource; applied: string[] }> {
  const dataSource = createDataSource(url);
  await dataSource.initialize();
  const applied = await dataSource.runMigrations({ transaction: 'each' });
  return { dataSource, applied: applied.map((m) => m.name) };
}
