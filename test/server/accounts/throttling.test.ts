import { ApiClient } from '../../utils/api-client';
import { startTestServer, type TestServer } from '../../utils/test-server';
import { TEST_PASSWORD } from './team-fixture';

// Each file starts a real server with a fresh database; on a shared 2-core machine that can
// take longer than jest's 5 s default.
jest.setTimeout(30_000);

describe('sign-in, register and reset throttling per address (express-rate-limit)', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ AUTH_RATE_LIMIT: '3', AUTH_RATE_WINDOW_MS: '60000' });
  });
  afterAll(async () => {
    await server.stop();
  });

  test('4th sign-in within the window → 429 rate_limited with draft-8 RateLimit headers', async () => {
    const client = new ApiClient(server.url);
    const body = { email: 'someone@example.test', password: 'wrong-password' };
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++)
      statuses.push((await client.post('/api/auth/sign-in', body)).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
    const res = await client.post('/api/auth/sign-in', body);
    expect(res.status).toBe(429);
    expect(res.body).toMatchObject({ error: { code: 'rate_limited' } });
    // IETF draft-ietf-httpapi-ratelimit-headers-08: RateLimit-Policy and RateLimit fields.
    expect(res.headers.get('ratelimit-policy')).toMatch(/q=3; w=60/);
    expect(res.headers.get('ratelimit')).toMatch(/r=0/);
    expect(Number(res.headers.get('retry-after'))).toBeGreaterThan(0);
  });

  test('register and password reset have their own counters → 429 on the 4th', async () => {
    const client = new ApiClient(server.url);
    const reg: number[] = [];
    for (let i = 0; i < 4; i++) {
      reg.push(
        (
          await client.post('/api/auth/register', {
            email: `r${i}@example.test`,
            password: TEST_PASSWORD,
          })
        ).status,
      );
    }
    expect(reg).toEqual([201, 201, 201, 429]);
    const reset: number[] = [];
    for (let i = 0; i < 4; i++) {
      reset.push(
        (await client.post('/api/auth/password-reset', { email: 'r0@example.test' })).status,
      );
    }
    expect(reset).toEqual([202, 202, 202, 429]);
  });
});

describe('growing per-account delay after failed sign-ins (in process memory)', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({
      AUTH_RATE_LIMIT: '1000',
      SIGN_IN_FREE_FAILURES: '2',
      SIGN_IN_DELAY_BASE_MS: '60000',
    });
    await new ApiClient(server.url).register('target@example.test', TEST_PASSWORD, 'Target');
  });
  afterAll(async () => {
    await server.stop();
  });

  test('3 failures → even the right password is refused with 429 naming the account wait', async () => {
    const client = new ApiClient(server.url);
    const wrong = { email: 'target@example.test', password: 'guess-guess-1' };
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++)
      statuses.push((await client.post('/api/auth/sign-in', wrong)).status);
    expect(statuses).toEqual([401, 401, 401]);
    const right = await client.post('/api/auth/sign-in', {
      email: 'TARGET@example.test',
      password: TEST_PASSWORD,
    });
    expect(right.status).toBe(429);
    expect(right.body).toMatchObject({
      error: {
        code: 'rate_limited',
        message: expect.stringMatching(/this account; try again in 60 s/),
      },
    });
  });

  test('another account from the same address → not delayed', async () => {
    const other = new ApiClient(server.url);
    await other.register('bystander@example.test', TEST_PASSWORD);
    const res = await new ApiClient(server.url).post('/api/auth/sign-in', {
      email: 'bystander@example.test',
      password: TEST_PASSWORD,
    });
    expect(res.status).toBe(200);
  });
});
