import * as Y from 'yjs';

import { PlanDocumentRepository } from '../../../server/data-access/repositories/plan-document-repository';
import { eventually } from '../../utils/collab-client';
import type { CollabTestServer } from '../../utils/collab-test-server';
import { useRelayRoom } from '../../utils/relay-room';

const ALICE = '00000000-0000-4000-8000-00000000000a';
const BOB = '00000000-0000-4000-8000-00000000000b';

/** The stored document, rebuilt from PostgreSQL alone. */
async function storedDoc(server: CollabTestServer, planId: string): Promise<Y.Doc> {
  const stored = await new PlanDocumentRepository(server.dataSource).load(planId);
  const doc = new Y.Doc();
  Y.applyUpdate(doc, stored.state);
  for (const u of stored.updates) Y.applyUpdate(doc, u.update);
  return doc;
}

describe('live plan relay: sync and storage', () => {
  const room = useRelayRoom('motor-drive-sync', { [ALICE]: 'editor', [BOB]: 'owner' });
  const { client, clients } = room;

  it('edit by one editor → applied by the other and present in PostgreSQL when acknowledged', async () => {
    const alice = client(ALICE);
    const bob = client(BOB);
    await Promise.all([alice.ready(), bob.ready()]);
    expect(alice.join).toEqual({ planId: room.planId, role: 'editor', readOnly: false });

    alice.doc.getMap('parts').set('U3', { kind: 'ldo', vout: 3.3 });
    await eventually(() => expect(alice.acknowledged).toHaveLength(1));
    // Acknowledged means committed: the stored document already holds the edit.
    const stored = await storedDoc(room.server, room.planId);
    expect(stored.getMap('parts').get('U3')).toEqual({ kind: 'ldo', vout: 3.3 });
    await eventually(() =>
      expect(bob.doc.getMap('parts').get('U3')).toEqual({ kind: 'ldo', vout: 3.3 }),
    );
  });

  it('late joiner → receives the stored plan, and presence of the others', async () => {
    const alice = clients[0]!;
    alice.setPresence({ user: { id: ALICE, name: 'Alice', colour: '#14507a' }, cursorTime: 0.002 });
    const carol = client(BOB);
    await carol.ready();
    expect(carol.doc.getMap('parts').get('U3')).toEqual({ kind: 'ldo', vout: 3.3 });
    await eventually(() => {
      const states = [...carol.awareness.getStates().values()] as Array<{ user?: { id: string } }>;
      expect(states.some((s) => s.user?.id === ALICE)).toBe(true);
    });
  });

  it('client disconnects → its presence is removed from the others at once', async () => {
    const dave = client(ALICE);
    await dave.ready();
    dave.setPresence({ user: { id: ALICE, name: 'Dave', colour: '#b86e00' } });
    const bob = clients[1]!;
    await eventually(() => expect(bob.awareness.getStates().has(dave.doc.clientID)).toBe(true));
    dave.socket.disconnect();
    await eventually(() => expect(bob.awareness.getStates().has(dave.doc.clientID)).toBe(false));
  });
});
