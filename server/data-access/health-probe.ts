import type { DataSource } from 'typeorm';

export interface DatabaseProbe {
  status: 'up' | 'down';
  latencyMs?: number;
  version?: string;
}

/** Really asks the database: one round trip, bounded by `timeoutMs`. */
export async function probeDatabase(
  dataSource: DataSource,
  timeoutMs = 2_000,
): Promise<DatabaseProbe> {
  if (!dataSource.isInitialized) return { status: 'down' };
  const started = performance.now();
  let timer: NodeJS.Timeout | undefined;
  try {
    const rows = (await Promise.race([
      dataSource.query('SELECT current_setting($1) AS version', ['server_version']),
      new Promise<never>((_, reject) => {
        timer = setTimeout(() => reject(new Error('database probe timed out')), timeoutMs);
      }),
    ])) as Array<{ version: string }>;
    return {
      status: 'up',
      latencyMs: Math.round((performance.now() - started) * 10) / 10,
      version: `PostgreSQL ${rows[0]?.version ?? '?'}`,
    };
  } catch {
    return { status: 'down' };
  } finally {
    clearTimeout(timer);
  }
}
