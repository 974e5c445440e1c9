import { validatePresence } from '@rampart/collab/sync/presence';

const user = { id: 'u-1', name: 'Grace', colour: '#b86e00' };

describe('validatePresence', () => {
  it('full presence (user, cursor, selection, viewport) → ok', () => {
    const p = {
      user,
      cursorTime: 0.0031,
      selection: [
        { kind: 'part', id: 'U2' },
        { kind: 'signal', id: 'pg5' },
      ],
      viewport: { t0: 0, t1: 0.02 },
    };
    expect(validatePresence(p)).toEqual({ ok: true, presence: p });
  });

  it.each([
    [{ user: { ...user, colour: 'orange' } }, 'user.colour'],
    [{ user: { ...user, name: '' } }, 'user.name'],
    [{ user: { ...user, extra: 1 } }, 'user'],
    [{ user, cursorTime: Number.NaN }, 'cursorTime'],
    [{ user, selection: [{ kind: 'teapot', id: 'x' }] }, 'selection[0].kind'],
    [{ user, viewport: { t0: 1, t1: 1 } }, 'viewport'],
    [{ user, secret: true }, 'secret'],
    ['not an object', 'presence'],
  ])('%j → refused naming %s', (value, field) => {
    expect(validatePresence(value)).toMatchObject({ ok: false, field });
  });
});
