import type { IncomingMessage } from 'node:http';

import { io as connect, type Socket } from 'socket.io-client';

import { ApiClient } from '../../utils/api-client';
import { startTestServer, type TestServer } from '../../utils/test-server';
import { TEST_PASSWORD, uniqueEmail } from './team-fixture';

// Each file starts a real server with a fresh database; on a shared 2-core machine that can
// take longer than jest's 5 s default.
jest.setTimeout(30_000);

describe('the session on the socket.io handshake', () => {
  let server: TestServer;
  const sockets: Socket[] = [];
  const seen: Array<Express.User | undefined> = [];
  beforeAll(async () => {
    server = await startTestServer();
    server.io.on('connection', (s) => {
      seen.push((s.request as IncomingMessage & { user?: Express.User }).user);
    });
  });
  afterAll(async () => {
    for (const s of sockets) s.disconnect();
    await server.stop();
  });

  const open = (cookie: string): Promise<Socket> =>
    new Promise((resolve, reject) => {
      const s = connect(server.url, {
        extraHeaders: { cookie },
        reconnection: false,
        forceNew: true,
      });
      sockets.push(s);
      s.once('connect', () => resolve(s));
      s.once('connect_error', reject);
    });

  test('signed-in cookie → socket.request.user is that user (and joined user:<id>)', async () => {
    const c = new ApiClient(server.url);
    const email = uniqueEmail('live');
    const me = await c.register(email, TEST_PASSWORD, 'Live');
    await open(c.cookieHeader);
    expect(seen.at(-1)).toMatchObject({ id: me.user.id, email });
    const inRoom = await server.io.in(`user:${me.user.id}`).fetchSockets();
    expect(inRoom).toHaveLength(1);
  });

  test('no cookie → connected, but with no user on the request', async () => {
    await open('');
    expect(seen.at(-1)).toBeUndefined();
  });

  test('sign out → that user’s sockets are disconnected by the server at once', async () => {
    const c = new ApiClient(server.url);
    await c.register(uniqueEmail('leaver'), TEST_PASSWORD);
    const socket = await open(c.cookieHeader);
    const reason = new Promise<string>((resolve) => socket.once('disconnect', resolve));
    await c.signOut();
    expect(await reason).toBe('io server disconnect');
  });
});
