import { hashLinkToken } from '../../../server/domain/secrets';
import { ApiClient, linkInMail, mailTo } from '../../utils/api-client';
import { startTestServer, type TestServer } from '../../utils/test-server';
import { TEST_PASSWORD, uniqueEmail } from './team-fixture';

// Each file starts a real server with a fresh database; on a shared 2-core machine that can
// take longer than jest's 5 s default.
jest.setTimeout(30_000);

describe('password reset by e-mailed one-time link', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ PASSWORD_RESET_TTL_MINUTES: '30' });
  });
  afterAll(async () => {
    await server.stop();
  });

  const requestReset = async (email: string): Promise<string> => {
    const res = await new ApiClient(server.url).post('/api/auth/password-reset', { email });
    expect(res.status).toBe(202);
    const link = await linkInMail(server.url, email, '/reset-password/');
    expect(link.startsWith(`${server.url}/reset-password/`)).toBe(true);
    return new URL(link).pathname.split('/').pop() ?? '';
  };

  test('unknown address → 202 as well, and no mail is sent', async () => {
    const email = uniqueEmail('ghost');
    const res = await new ApiClient(server.url).post('/api/auth/password-reset', { email });
    expect(res.status).toBe(202);
    expect(await mailTo(server.url, email)).toEqual([]);
  });

  test('reset → token stored only as SHA-256, expiring after PASSWORD_RESET_TTL_MINUTES', async () => {
    const email = uniqueEmail('hash');
    await new ApiClient(server.url).register(email, TEST_PASSWORD);
    const before = Date.now();
    const token = await requestReset(email);
    const rows: Array<{ token_hash: string; expires_at: Date }> = await server.dataSource.query(
      `SELECT r.token_hash, r.expires_at FROM password_reset_tokens r
         JOIN users u ON u.id = r.user_id WHERE u.email = $1`,
      [email],
    );
    expect(rows).toHaveLength(1);
    expect(rows[0]?.token_hash).toBe(hashLinkToken(token));
    const minutes = ((rows[0]?.expires_at.getTime() ?? 0) - before) / 60_000;
    expect(minutes).toBeGreaterThan(29.9);
    expect(minutes).toBeLessThan(30.1);
  });

  test('confirm → new password works, old fails, sessions end; second use → 422', async () => {
    const email = uniqueEmail('reset');
    const signedIn = new ApiClient(server.url);
    await signedIn.register(email, TEST_PASSWORD);
    const token = await requestReset(email);
    const anon = new ApiClient(server.url);
    const ok = await anon.post('/api/auth/password-reset/confirm', {
      token,
      password: 'brand-new-password',
    });
    expect(ok.status).toBe(204);
    expect((await signedIn.me()).status).toBe(401);
    await new ApiClient(server.url).signIn(email, 'brand-new-password');
    const old = await new ApiClient(server.url).post('/api/auth/sign-in', {
      email,
      password: TEST_PASSWORD,
    });
    expect(old.status).toBe(401);
    const again = await anon.post('/api/auth/password-reset/confirm', {
      token,
      password: 'another-new-password',
    });
    expect(again.status).toBe(422);
    expect(again.body).toMatchObject({
      error: { code: 'unprocessable', fields: [{ path: 'token' }] },
    });
  });

  test('expired token → 422 and the password is unchanged', async () => {
    const email = uniqueEmail('expired');
    await new ApiClient(server.url).register(email, TEST_PASSWORD);
    const token = await requestReset(email);
    await server.dataSource.query(
      `UPDATE password_reset_tokens SET expires_at = now() - interval '1 second' WHERE token_hash = $1`,
      [hashLinkToken(token)],
    );
    const res = await new ApiClient(server.url).post('/api/auth/password-reset/confirm', {
      token,
      password: 'brand-new-password',
    });
    expect(res.status).toBe(422);
    await new ApiClient(server.url).signIn(email, TEST_PASSWORD);
  });

  test('two links requested → using the newer one spends the older one too', async () => {
    const email = uniqueEmail('two');
    await new ApiClient(server.url).register(email, TEST_PASSWORD);
    const first = await requestReset(email);
    const second = await requestReset(email);
    expect(second).not.toBe(first);
    const c = new ApiClient(server.url);
    expect(
      (
        await c.post('/api/auth/password-reset/confirm', {
          token: second,
          password: 'newer-password-1',
        })
      ).status,
    ).toBe(204);
    expect(
      (
        await c.post('/api/auth/password-reset/confirm', {
          token: first,
          password: 'older-password-1',
        })
      ).status,
    ).toBe(422);
  });
});
