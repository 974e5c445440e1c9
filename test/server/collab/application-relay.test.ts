import { io } from 'socket.io-client';
import * as Y from 'yjs';

import type { SnapshotDto } from '@rampart/collab/sync/snapshots-api';
import { demoPlanUpdate } from '@rampart/collab/doc/demo-plan';
import { collection } from '@rampart/collab/doc/doc-layout';
import type { PlanDiff } from '@rampart/collab/doc/diff-plans';
import { PLAN_NAMESPACE } from '@rampart/collab/sync/events';

import { seedPlanDocument } from '../../../server/data-access/repositories/plan-document-seed';
import { eventually, TestPlanClient } from '../../utils/collab-client';
import { startTestServer, type TestServer } from '../../utils/test-server';
import { createTeamWithAllRoles, type TeamFixture } from '../accounts/team-fixture';

jest.setTimeout(30_000);

/** R1 (the 5 V buck's enable divider, top) of the demo plan, in a client's doc. */
function r1Value(doc: Y.Doc): unknown {
  return collection(doc, 'parts').get('R1')?.get('value');
}

describe('live plans in the full application: session handshake, roles, snapshots', () => {
  let server: TestServer;
  let team: TeamFixture;
  let planId: string;
  const clients: TestPlanClient[] = [];

  beforeAll(async () => {
    server = await startTestServer();
    team = await createTeamWithAllRoles(server.url, 'Motor drive team');
    const plan = await team.clients.owner.post<{ id: string }>('/api/plans', {
      teamId: team.teamId,
      name: 'Motor-drive controller',
    });
    expect(plan.status).toBe(201);
    planId = plan.body.id;
    expect(await seedPlanDocument(server.dataSource, planId, demoPlanUpdate())).toBe(true);
  });

  afterAll(async () => {
    for (const c of clients) c.close();
    await server.stop();
  });

  function client(role: 'owner' | 'editor' | 'reviewer' | 'viewer'): TestPlanClient {
    const c = new TestPlanClient(server.url, team.userIds[role], planId, {
      cookie: team.clients[role].cookieHeader,
    });
    clients.push(c);
    return c;
  }

  it('signed-in editor and viewer join → both get the demo plan; the viewer is read-only', async () => {
    const editor = client('editor');
    const viewer = client('viewer');
    await Promise.all([editor.ready(), viewer.ready()]);
    expect(editor.join).toMatchObject({ role: 'editor', readOnly: false });
    expect(viewer.join).toMatchObject({ role: 'viewer', readOnly: true });
    expect(r1Value(viewer.doc)).toBe(100_000);
    collection(editor.doc, 'parts').get('R1')!.set('value', 120_000);
    await eventually(() => expect(r1Value(viewer.doc)).toBe(120_000));
    collection(viewer.doc, 'parts').get('R1')!.set('value', 1);
    await eventually(() => expect(viewer.errors.map((e) => e.code)).toContain('read_only'));
    expect(r1Value(server.collab.registry.get(planId)!.doc)).toBe(120_000);
  });

  it('socket without a session cookie → refused with unauthenticated', async () => {
    const socket = io(`${server.url}${PLAN_NAMESPACE}`, {
      transports: ['websocket'],
      forceNew: true,
    });
    const error = await new Promise<Error & { data?: { code: string } }>((r) =>
      socket.once('connect_error', r),
    );
    socket.disconnect();
    expect(error.data?.code).toBe('unauthenticated');
  });

  it('snapshot, edit, restore → the edit is undone by a new stored update; compare names the part', async () => {
    const owner = team.clients.owner;
    const editor = clients[0]!;
    const created = await owner.post<SnapshotDto>(`/api/plans/${planId}/snapshots`, {
      message: 'Before changing the enable divider',
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ planId, message: 'Before changing the enable divider' });
    expect(created.body.contentHash).toMatch(/^sha256:[0-9a-f]{64}$/);

    collection(editor.doc, 'parts').get('R1')!.set('value', 150_000);
    await eventually(() => expect(r1Value(server.collab.registry.get(planId)!.doc)).toBe(150_000));

    const compared = await owner.get<{ diff: PlanDiff }>(
      `/api/plans/${planId}/snapshots/compare?from=${created.body.id}&to=current&margins=nominal`,
    );
    expect(compared.status).toBe(200);
    expect(compared.body.diff.parts.map((p) => p.id)).toEqual(['R1']);
    // R1 sets the 5 V buck's enable threshold (divider R1/R2 from 24 V), so a larger R1 moves
    // the 5 V start later and changes the sequencing margins that follow it.
    expect(compared.body.diff.margins.length).toBeGreaterThan(0);

    const restored = await owner.post<{ seq: number | null }>(
      `/api/plans/${planId}/snapshots/${created.body.id}/restore`,
    );
    expect(restored.status).toBe(200);
    expect(restored.body.seq).toBeGreaterThan(0);
    // Connected clients receive the restore like any edit.
    await eventually(() => expect(r1Value(editor.doc)).toBe(120_000));

    const list = await owner.get<SnapshotDto[]>(`/api/plans/${planId}/snapshots`);
    expect(list.body.map((s) => s.id)).toEqual([created.body.id]);
  });

  it('viewer creates a snapshot → 403; bad body → 400 naming the field', async () => {
    const denied = await team.clients.viewer.post(`/api/plans/${planId}/snapshots`, {
      message: 'x',
    });
    expect(denied.status).toBe(403);
    const bad = await team.clients.owner.post(`/api/plans/${planId}/snapshots`, { message: '' });
    expect(bad.status).toBe(400);
    expect(bad.body).toMatchObject({
      error: { code: 'validation_failed', fields: [{ path: 'message' }] },
    });
  });

  it('member removed from the team while connected → leaves the plan at once', async () => {
    const reviewer = client('reviewer');
    await reviewer.ready();
    const res = await team.clients.owner.request(
      'DELETE',
      `/api/teams/${team.teamId}/members/${team.userIds.reviewer}`,
    );
    expect(res.status).toBe(204);
    await eventually(() =>
      expect(reviewer.accessChanges).toContainEqual({ role: null, readOnly: true }),
    );
  });

  it('user signs out → their live-plan sockets are closed', async () => {
    const editor = clients[0]!;
    await team.clients.editor.signOut();
    await eventually(() => expect(editor.socket.connected).toBe(false));
  });
});
