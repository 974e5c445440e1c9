import { SESSION_COOKIE } from '../../../server/entry-points/http/session-auth';
import { ApiClient } from '../../utils/api-client';
import { startTestServer, type TestServer } from '../../utils/test-server';
import { TEST_PASSWORD, uniqueEmail } from './team-fixture';

// Each file starts a real server with a fresh database; on a shared 2-core machine that can
// take longer than jest's 5 s default.
jest.setTimeout(30_000);

const TABLES = [
  'users',
  'teams',
  'memberships',
  'plans',
  'invitations',
  'password_reset_tokens',
  'plan_role_overrides',
];

async function rowCounts(server: TestServer): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const t of TABLES) {
    const rows: Array<{ n: string }> = await server.dataSource.query(
      `SELECT count(*) AS n FROM ${t}`,
    );
    out[t] = Number(rows[0]?.n);
  }
  return out;
}

describe('CSRF, tampered cookies, injection and oversized bodies', () => {
  let server: TestServer;
  let member: ApiClient;
  let teamId: string;
  beforeAll(async () => {
    server = await startTestServer();
    member = new ApiClient(server.url);
    await member.register(uniqueEmail('member'), TEST_PASSWORD, 'Member');
    teamId = (await member.post<{ id: string }>('/api/teams', { name: 'Protection team' })).body.id;
  });
  afterAll(async () => {
    await server.stop();
  });

  test('POST without the CSRF header → 403 csrf_invalid, nothing created', async () => {
    const before = await rowCounts(server);
    const res = await member.post('/api/teams', { name: 'Sneaky' }, { withoutCsrf: true });
    expect(res.status).toBe(403);
    expect(res.body).toMatchObject({ error: { code: 'csrf_invalid' } });
    expect(await rowCounts(server)).toEqual(before);
  });

  test('POST with a wrong or another session’s CSRF token → 403 csrf_invalid', async () => {
    const other = new ApiClient(server.url);
    const othersToken = await other.csrfToken();
    for (const token of ['0'.repeat(256), othersToken]) {
      const res = await member.post(
        '/api/teams',
        { name: 'Sneaky' },
        { withoutCsrf: true, headers: { 'x-csrf-token': token } },
      );
      expect(res.status).toBe(403);
      expect(res.body).toMatchObject({ error: { code: 'csrf_invalid' } });
    }
  });

  test('sign-in without a CSRF token (login CSRF) → 403 csrf_invalid', async () => {
    const res = await new ApiClient(server.url).post(
      '/api/auth/sign-in',
      { email: 'a@example.test', password: 'whatever-1' },
      { withoutCsrf: true },
    );
    expect(res.status).toBe(403);
  });

  test('tampered session cookie signature → 401; the untampered cookie still works', async () => {
    const original = member.cookies.get(SESSION_COOKIE) ?? '';
    const decoded = decodeURIComponent(original);
    const last = decoded.at(-1) === 'A' ? 'B' : 'A';
    const tampered = new ApiClient(server.url);
    tampered.cookies.set(SESSION_COOKIE, encodeURIComponent(decoded.slice(0, -1) + last));
    expect((await tampered.me()).status).toBe(401);

    // The session id alone, without a valid signature, is not enough either.
    const unsigned = new ApiClient(server.url);
    unsigned.cookies.set(SESSION_COOKIE, encodeURIComponent(decoded.split('.')[0] ?? ''));
    expect((await unsigned.me()).status).toBe(401);

    expect((await member.me()).status).toBe(200);
  });

  test('SQL-injection strings in bodies and path parameters → 4xx, no table changes', async () => {
    const before = await rowCounts(server);
    const injection = "x' OR '1'='1'; DELETE FROM users; --";
    const attempts: Array<Promise<{ status: number }>> = [
      new ApiClient(server.url).post('/api/auth/sign-in', { email: injection, password: 'x' }),
      new ApiClient(server.url).post('/api/auth/sign-in', {
        email: 'member@example.test',
        password: injection,
      }),
      new ApiClient(server.url).post('/api/auth/register', {
        email: injection,
        password: injection,
      }),
      member.get(`/api/teams/${encodeURIComponent(injection)}/members`),
      member.delete(`/api/teams/${teamId}/members/${encodeURIComponent(injection)}`),
      member.patch(`/api/teams/${teamId}/members/${encodeURIComponent("' OR 1=1 --")}`, {
        role: 'owner',
      }),
      member.get(`/api/plans/${encodeURIComponent(injection)}`),
      member.delete(
        `/api/plans/${encodeURIComponent("00000000-0000-0000-0000-000000000000' OR '1'='1")}`,
      ),
      member.get(`/api/invitations/${encodeURIComponent(injection)}`),
      member.post(`/api/teams/${teamId}/invitations`, { email: injection, role: 'viewer' }),
      member.post(`/api/teams/${teamId}/invitations`, { email: 'a@example.test', role: injection }),
      member.post('/api/plans', { teamId: injection, name: 'x' }),
    ];
    const statuses = (await Promise.all(attempts)).map((r) => r.status);
    for (const s of statuses) {
      expect(s).toBeGreaterThanOrEqual(400);
      expect(s).toBeLessThan(500);
    }
    expect(await rowCounts(server)).toEqual(before);
  });

  test('an injection string as a team name is stored literally, as data', async () => {
    const name = "Robert'); DROP TABLE teams; --";
    const res = await member.post<{ id: string; name: string }>('/api/teams', { name });
    expect(res.status).toBe(201);
    expect(res.body.name).toBe(name);
    const rows: Array<{ name: string }> = await server.dataSource.query(
      'SELECT name FROM teams WHERE id = $1',
      [res.body.id],
    );
    expect(rows[0]?.name).toBe(name);
  });

  test('oversized bodies → 413 payload_too_large / 400 for too-long fields, no table changes', async () => {
    const before = await rowCounts(server);
    const huge = await new ApiClient(server.url).post('/api/auth/register', undefined, {
      rawBody: JSON.stringify({ email: 'big@example.test', password: 'x'.repeat(400_000) }),
    });
    expect(huge.status).toBe(413);
    expect(huge.body).toMatchObject({ error: { code: 'payload_too_large' } });
    const longName = await new ApiClient(server.url).post('/api/auth/register', {
      email: 'long@example.test',
      password: TEST_PASSWORD,
      name: 'n'.repeat(10_000),
    });
    expect(longName.status).toBe(400);
    expect(longName.body).toMatchObject({ error: { fields: [{ path: 'name' }] } });
    const longPassword = await new ApiClient(server.url).post('/api/auth/register', {
      email: 'long@example.test',
      password: 'é'.repeat(40),
    });
    // 80 bytes in UTF-8: bcrypt would silently ignore everything after byte 72.
    expect(longPassword.status).toBe(400);
    expect(await rowCounts(server)).toEqual(before);
  });

  test('error bodies never carry stacks or SQL', async () => {
    const res = await member.get(`/api/plans/${encodeURIComponent("1'; SELECT pg_sleep(1); --")}`);
    const text = JSON.stringify(res.body);
    expect(text).not.toMatch(/SELECT|at .*\.ts|QueryFailedError|stack/i);
  });
});
