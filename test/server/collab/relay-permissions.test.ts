import { io } from 'socket.io-client';
import * as Y from 'yjs';

import { PLAN_NAMESPACE } from '@rampart/collab/sync/events';
import { encodeUpdate } from '@rampart/collab/sync/wire-codec';

import { PlanDocumentRepository } from '../../../server/data-access/repositories/plan-document-repository';
import { eventually } from '../../utils/collab-client';
import { useRelayRoom } from '../../utils/relay-room';

const OWNER = '00000000-0000-4000-8000-000000000001';
const VIEWER = '00000000-0000-4000-8000-000000000002';
const REVIEWER = '00000000-0000-4000-8000-000000000003';
const EDITOR = '00000000-0000-4000-8000-000000000004';
const STRANGER = '00000000-0000-4000-8000-000000000005';

describe('live plan relay: roles enforced by the server', () => {
  const room = useRelayRoom('motor-drive-roles', {
    [OWNER]: 'owner',
    [VIEWER]: 'viewer',
    [REVIEWER]: 'reviewer',
    [EDITOR]: 'editor',
  });
  const { client, access } = room;

  async function storedParts(): Promise<Record<string, unknown>> {
    const stored = await new PlanDocumentRepository(room.server.dataSource).load(room.planId);
    const doc = new Y.Doc();
    Y.applyUpdate(doc, stored.state);
    for (const u of stored.updates) Y.applyUpdate(doc, u.update);
    return doc.getMap('parts').toJSON();
  }

  it.each([
    ['viewer', VIEWER],
    ['reviewer', REVIEWER],
  ])('%s edits → update denied, never stored, never seen by others', async (role, user) => {
    const owner = client(OWNER);
    const watcher = client(user);
    await Promise.all([owner.ready(), watcher.ready()]);
    expect(watcher.join).toMatchObject({ role, readOnly: true });

    owner.doc.getMap('parts').set(`R-${role}`, { ohms: 10_000 });
    await eventually(() =>
      expect(watcher.doc.getMap('parts').get(`R-${role}`)).toEqual({ ohms: 10_000 }),
    );

    // The local client applies its own edit; the relay must drop it.
    watcher.doc.getMap('parts').set(`bad-${role}`, { ohms: 1 });
    const res = await watcher.sendRaw(encodeUpdate(Y.encodeStateAsUpdate(watcher.doc)));
    expect(res).toMatchObject({ error: { code: 'read_only' } });
    await eventually(() => expect(watcher.errors.some((e) => e.code === 'read_only')).toBe(true));

    // A later edit by the owner reaches everyone; the denied one reached nobody.
    owner.doc.getMap('parts').set(`after-${role}`, true);
    await eventually(() => expect(owner.acknowledged.length).toBeGreaterThanOrEqual(2));
    await eventually(() => expect(watcher.doc.getMap('parts').get(`after-${role}`)).toBe(true));
    expect(owner.doc.getMap('parts').has(`bad-${role}`)).toBe(false);
    expect(
      room.server.relay.registry.get(room.planId)!.doc.getMap('parts').has(`bad-${role}`),
    ).toBe(false);
    expect(await storedParts()).not.toHaveProperty(`bad-${role}`);
  });

  it('viewer rejoins after an offline edit → its step 2 is dropped, the plan unchanged', async () => {
    const viewer = client(VIEWER);
    await viewer.ready();
    viewer.socket.disconnect();
    viewer.doc.getMap('parts').set('offline-viewer-edit', 1);
    viewer.socket.connect();
    await eventually(() => expect(viewer.errors.some((e) => e.code === 'read_only')).toBe(true));
    expect(await storedParts()).not.toHaveProperty('offline-viewer-edit');
  });

  it('socket without a signed-in user → refused with unauthenticated', async () => {
    const socket = io(`${room.server.url}${PLAN_NAMESPACE}`, {
      transports: ['websocket'],
      forceNew: true,
    });
    const error = await new Promise<Error & { data?: { code: string } }>((resolve) =>
      socket.once('connect_error', resolve),
    );
    socket.disconnect();
    expect(error.data?.code).toBe('unauthenticated');
  });

  it('socket from a foreign page origin → refused with origin_denied', async () => {
    const socket = io(`${room.server.url}${PLAN_NAMESPACE}`, {
      transports: ['websocket'],
      forceNew: true,
      query: { testUser: OWNER },
      extraHeaders: { origin: 'http://evil.example' },
    });
    const error = await new Promise<Error & { data?: { code: string } }>((resolve) =>
      socket.once('connect_error', resolve),
    );
    socket.disconnect();
    expect(error.data?.code).toBe('origin_denied');
  });

  it('non-member joins → forbidden; unknown plan → not_found', async () => {
    const stranger = client(STRANGER);
    await eventually(() => expect(stranger.joinError?.code).toBe('forbidden'));
    const lost = client(OWNER, '7b0e0f4e-0000-4000-8000-000000000000');
    await eventually(() => expect(lost.joinError?.code).toBe('not_found'));
  });

  it('member removed while connected → leaves the room at once and receives nothing more', async () => {
    const owner = client(OWNER);
    const editor = client(EDITOR);
    await Promise.all([owner.ready(), editor.ready()]);
    access.revoke(room.planId, EDITOR);
    await eventually(() =>
      expect(editor.accessChanges).toContainEqual({ role: null, readOnly: true }),
    );
    owner.doc.getMap('parts').set('after-revoke', 1);
    await eventually(() => expect(owner.acknowledged.some(() => true)).toBe(true));
    editor.doc.getMap('parts').set('from-revoked', 1);
    const res = await editor.sendRaw(encodeUpdate(Y.encodeStateAsUpdate(editor.doc)));
    expect(res).toMatchObject({ error: { code: 'not_joined' } });
    await new Promise((r) => setTimeout(r, 100));
    expect(editor.doc.getMap('parts').has('after-revoke')).toBe(false);
    expect(await storedParts()).not.toHaveProperty('from-revoked');
  });

  it('editor lowered to viewer while connected → the next update is denied', async () => {
    access.grant(room.planId, EDITOR, 'editor');
    const editor = client(EDITOR);
    await editor.ready();
    access.grant(room.planId, EDITOR, 'viewer');
    await eventually(() =>
      expect(editor.accessChanges).toContainEqual({ role: 'viewer', readOnly: true }),
    );
    editor.doc.getMap('parts').set('from-downgraded', 1);
    await eventually(() => expect(editor.errors.some((e) => e.code === 'read_only')).toBe(true));
    expect(await storedParts()).not.toHaveProperty('from-downgraded');
  });

  it('user signs out → every socket of theirs is closed', async () => {
    const owner = client(OWNER);
    await owner.ready();
    access.signOut(OWNER);
    await eventually(() => expect(owner.socket.connected).toBe(false));
  });
});
