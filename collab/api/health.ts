/** Body of `GET /api/health`, shared by the server that builds it and the client that shows it. */
export interface HealthReport {
  /** `ok` when every dependency answers; `degraded` otherwise (HTTP 503). */
  status: 'ok' | 'degraded';
  server: { status: 'up'; version: string; uptimeSeconds: number };
  database: {
    status: 'up' | 'down';
    /** Round-trip time of the probe query, milliseconds; absent when down. */
    latencyMs?: number;
    /** Server version string reported by the database; absent when down. */
    version?: string;
  };
  /** ISO time the report was made. */
  checkedAt: string;
}

/** Narrows an unknown JSON body to a `HealthReport`, or returns `null`. */
export function parseHealthReport(body: unknown): HealthReport | null {
  if (typeof body !== 'object' || body === null) return null;
  const b = body as Partial<HealthReport>;
  const okStatus = b.status === 'ok' || b.status === 'degraded';
  const okServer = b.server?.status === 'up' && typeof b.server.version === 'string';
  const okDb = b.database?.status === 'up' || b.database?.status === 'down';
  return okStatus && okServer && okDb && typeof b.checkedAt === 'string'
    ? (b as HealthReport)
    : null;
}
