import { parseHealthReport } from '@rampart/collab/api/health';
import { startTestServer, type TestServer } from '../utils/test-server';

describe('GET /api/health', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(async () => {
    await server.stop();
  });

  test('with the database up → 200, database up, a real PostgreSQL version', async () => {
    const res = await fetch(`${server.url}/api/health`);
    expect(res.status).toBe(200);
    const report = parseHealthReport(await res.json());
    expect(report?.status).toBe('ok');
    expect(report?.database.status).toBe('up');
    expect(report?.database.version).toMatch(/^PostgreSQL 15\./);
    expect(res.headers.get('cache-control')).toBe('no-store');
  });

  test('the probe really queries: migrations ran and the demo seed is off in tests', async () => {
    const rows: Array<{ n: string }> = await server.dataSource.query(
      'SELECT count(*) AS n FROM plans',
    );
    expect(rows[0]?.n).toBe('0');
    const migrations: Array<{ name: string }> = await server.dataSource.query(
      'SELECT name FROM migrations',
    );
    expect(migrations.map((m) => m.name)).toContain('CreatePlans1764626400000');
  });

  test('unknown API route → 404 in the API error shape', async () => {
    const res = await fetch(`${server.url}/api/no-such-thing`);
    expect(res.status).toBe(404);
    expect(await res.json()).toEqual({
      error: { code: 'not_found', message: 'No API route GET /no-such-thing' },
    });
  });

  test('malformed JSON body → 400 bad_request, no stack in the body', async () => {
    const res = await fetch(`${server.url}/api/health`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{"broken": ',
    });
    expect(res.status).toBe(400);
    const text = await res.text();
    expect(JSON.parse(text)).toEqual({
      error: { code: 'bad_request', message: 'Request body is not valid JSON' },
    });
    expect(text).not.toMatch(/at .*\.ts|SyntaxError/);
  });

  test('oversized JSON body → 413 payload_too_large', async () => {
    const res = await fetch(`${server.url}/api/health`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ pad: 'x'.repeat(300_000) }),
    });
    expect(res.status).toBe(413);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe(
      'payload_too_large',
    );
  });

  test('security headers from helmet are present', async () => {
    const res = await fetch(`${server.url}/api/health`);
    expect(res.headers.get('content-security-policy')).toContain("script-src 'self'");
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('x-powered-by')).toBeNull();
  });

  test('with the database gone → 503 and database down (same body shape)', async () => {
    await server.dataSource.destroy();
    const res = await fetch(`${server.url}/api/health`);
    expect(res.status).toBe(503);
    const report = parseHealthReport(await res.json());
    expect(report?.status).toBe('degraded');
    expect(report?.database.status).toBe('down');
    await server.dataSource.initialize();
  });
});
