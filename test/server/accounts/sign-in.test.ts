import bcrypt from 'bcryptjs';

import type { MeResponse } from '@rampart/collab/api/accounts';
import { SESSION_COOKIE } from '../../../server/entry-points/http/session-auth';
import { ApiClient } from '../../utils/api-client';
import { startTestServer, type TestServer } from '../../utils/test-server';

// Each file starts a real server with a fresh database; on a shared 2-core machine that can
// take longer than jest's 5 s default.
jest.setTimeout(30_000);

describe('register, sign in, who am I, sign out', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(async () => {
    await server.stop();
  });

  test('GET /api/auth/me signed out → 401 unauthenticated in the API error shape', async () => {
    const res = await new ApiClient(server.url).me();
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'unauthenticated', message: 'Sign in first' } });
  });

  test('register → 201, signed in; stored hash is bcrypt (cost ≥ 10), not the password', async () => {
    const client = new ApiClient(server.url);
    const created = await client.register(
      'Ada.Lovelace@Example.test',
      'correct-horse-battery',
      'Ada',
    );
    expect(created.user).toMatchObject({ email: 'ada.lovelace@example.test', name: 'Ada' });
    expect(created.memberships).toEqual([]);
    expect((await client.me()).body.user.email).toBe('ada.lovelace@example.test');

    const rows: Array<{ password_hash: string }> = await server.dataSource.query(
      'SELECT password_hash FROM users WHERE email = $1',
      ['ada.lovelace@example.test'],
    );
    const hash = rows[0]?.password_hash ?? '';
    expect(hash).not.toContain('correct-horse-battery');
    // bcrypt modular-crypt format: $2<variant>$<cost>$… (bcryptjs README; OpenBSD bcrypt(3)).
    expect(hash).toMatch(/^\$2[aby]\$\d\d\$/);
    expect(bcrypt.getRounds(hash)).toBeGreaterThanOrEqual(10);
    expect(await bcrypt.compare('correct-horse-battery', hash)).toBe(true);
    expect(await bcrypt.compare('wrong-horse-battery', hash)).toBe(false);
  });

  test('register the same e-mail again (other case) → 409 conflict naming the email field', async () => {
    const client = new ApiClient(server.url);
    const res = await client.post('/api/auth/register', {
      email: 'ADA.LOVELACE@example.test',
      password: 'another-password',
    });
    expect(res.status).toBe(409);
    expect(res.body).toMatchObject({ error: { code: 'conflict', fields: [{ path: 'email' }] } });
  });

  test('register with a short password and a bad e-mail → 400 naming both fields', async () => {
    const res = await new ApiClient(server.url).post('/api/auth/register', {
      email: 'not-an-address',
      password: 'short',
    });
    expect(res.status).toBe(400);
    const body = res.body as { error: { code: string; fields: Array<{ path: string }> } };
    expect(body.error.code).toBe('validation_failed');
    expect(body.error.fields.map((f) => f.path).sort()).toEqual(['email', 'password']);
  });

  test('sign in → new session id (regenerated), me works; sign out → session row gone, me 401', async () => {
    const client = new ApiClient(server.url);
    await client.csrfToken();
    const before = client.cookies.get(SESSION_COOKIE);
    expect(before).toBeDefined();
    const signedIn = await client.signIn('ada.lovelace@example.test', 'correct-horse-battery');
    expect(signedIn.csrfToken).toMatch(/^[0-9a-f]{256}$/);
    const after = client.cookies.get(SESSION_COOKIE);
    expect(after).toBeDefined();
    expect(after).not.toBe(before);
    const me = await client.me();
    expect(me.status).toBe(200);
    expect((me.body as MeResponse).user.email).toBe('ada.lovelace@example.test');

    const sid = decodeURIComponent(after ?? '')
      .slice(2)
      .split('.')[0];
    const count = async (): Promise<number> =>
      Number(
        (
          (await server.dataSource.query('SELECT count(*) AS n FROM sessions WHERE sid = $1', [
            sid,
          ])) as Array<{ n: string }>
        )[0]?.n,
      );
    expect(await count()).toBe(1);
    await client.signOut();
    expect(await count()).toBe(0);
    expect((await client.me()).status).toBe(401);
  });

  test('session cookie → httpOnly, SameSite=Lax, not Secure over plain http', async () => {
    const res = await fetch(`${server.url}/api/auth/csrf`);
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith(`${SESSION_COOKIE}=`));
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
  });

  test('session cookie over TLS (X-Forwarded-Proto https from loopback proxy) → Secure', async () => {
    const res = await fetch(`${server.url}/api/auth/csrf`, {
      headers: { 'x-forwarded-proto': 'https' },
    });
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith(`${SESSION_COOKIE}=`));
    expect(cookie).toMatch(/; Secure/i);
  });

  test('sign in with a wrong password → 401 with the same message as an unknown e-mail', async () => {
    const client = new ApiClient(server.url);
    const wrong = await client.post('/api/auth/sign-in', {
      email: 'ada.lovelace@example.test',
      password: 'not-her-password',
    });
    const unknown = await client.post('/api/auth/sign-in', {
      email: 'nobody@example.test',
      password: 'not-her-password',
    });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  test('change password → old one refused, new one works, other sessions end', async () => {
    const a = new ApiClient(server.url);
    const b = new ApiClient(server.url);
    await a.register('grace@example.test', 'first-password-1');
    await b.signIn('grace@example.test', 'first-password-1');
    const res = await a.post('/api/auth/password', {
      currentPassword: 'first-password-1',
      newPassword: 'second-password-2',
    });
    expect(res.status).toBe(204);
    expect((await a.me()).status).toBe(200);
    expect((await b.me()).status).toBe(401);
    const old = await new ApiClient(server.url).post('/api/auth/sign-in', {
      email: 'grace@example.test',
      password: 'first-password-1',
    });
    expect(old.status).toBe(401);
    await new ApiClient(server.url).signIn('grace@example.test', 'second-password-2');
  });

  test('change password with a wrong current password → 400 naming currentPassword', async () => {
    const a = new ApiClient(server.url);
    await a.signIn('grace@example.test', 'second-password-2');
    const res = await a.post('/api/auth/password', {
      currentPassword: 'nope-nope-nope',
      newPassword: 'third-password-3',
    });
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ error: { fields: [{ path: 'currentPassword' }] } });
  });
});
