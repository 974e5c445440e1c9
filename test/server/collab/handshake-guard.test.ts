import type { IncomingMessage } from 'node:http';

import {
  isOriginAllowed,
  passportUser,
  reloadSession,
} from '../../../server/collab/handshake-guard';

function request(headers: Record<string, string>, extra: object = {}): IncomingMessage {
  return { headers, ...extra } as unknown as IncomingMessage;
}

describe('handshake checks', () => {
  it('isOriginAllowed: none, own host, listed → true; another site → false', () => {
    expect(isOriginAllowed(request({ host: '127.0.0.1:4300' }), [])).toBe(true);
    expect(
      isOriginAllowed(request({ host: '127.0.0.1:4300', origin: 'http://127.0.0.1:4300' }), []),
    ).toBe(true);
    expect(
      isOriginAllowed(request({ host: 'a.test', origin: 'https://b.test' }), ['https://b.test']),
    ).toBe(true);
    expect(
      isOriginAllowed(request({ host: '127.0.0.1:4300', origin: 'http://evil.test' }), []),
    ).toBe(false);
    // Same host name, other port: another origin (RFC 6454 §4: scheme, host and port).
    expect(
      isOriginAllowed(request({ host: '127.0.0.1:4300', origin: 'http://127.0.0.1:4301' }), []),
    ).toBe(false);
  });

  it('passportUser: request with a user → its id and name; without → null', () => {
    expect(passportUser(request({}, { user: { id: 'u1', name: 'Ada', email: 'x' } }))).toEqual({
      id: 'u1',
      name: 'Ada',
    });
    expect(passportUser(request({}))).toBeNull();
  });

  it('reloadSession: still signed in → true; destroyed or signed out → false; no session → true', async () => {
    const session = (err: unknown, user: unknown) => ({
      reload(cb: (e?: unknown) => void) {
        cb(err);
      },
      passport: user === undefined ? undefined : { user },
    });
    expect(await reloadSession(request({}, { session: session(undefined, 'u1') }))).toBe(true);
    expect(await reloadSession(request({}, { session: session(new Error('gone'), 'u1') }))).toBe(
      false,
    );
    expect(await reloadSession(request({}, { session: session(undefined, undefined) }))).toBe(
      false,
    );
    expect(await reloadSession(request({}))).toBe(true);
  });
});
