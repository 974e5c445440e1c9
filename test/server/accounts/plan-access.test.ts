import type { PlanSummaryDto } from '@rampart/collab/api/accounts';
import { ApiClient } from '../../utils/api-client';
import { startTestServer, type TestServer } from '../../utils/test-server';
import {
  createTeamWithAllRoles,
  TEST_PASSWORD,
  uniqueEmail,
  type TeamFixture,
} from './team-fixture';

// Each file starts a real server with a fresh database; on a shared 2-core machine that can
// take longer than jest's 5 s default.
jest.setTimeout(30_000);

describe('plans of a team and per-plan role overrides', () => {
  let server: TestServer;
  let t: TeamFixture;
  let planId: string;
  let otherPlanId: string;
  beforeAll(async () => {
    server = await startTestServer();
    t = await createTeamWithAllRoles(server.url, 'Motor-drive controller team');
    const make = async (name: string) =>
      (await t.clients.editor.post<PlanSummaryDto>('/api/plans', { teamId: t.teamId, name })).body
        .id;
    planId = await make('Power-up order');
    otherPlanId = await make('Power-down order');
  });
  afterAll(async () => {
    await server.stop();
  });

  test('GET /api/plans → the team’s plans with the caller’s role; outsiders see none', async () => {
    const res = await t.clients.reviewer.get<PlanSummaryDto[]>('/api/plans');
    expect(res.body.map((p) => [p.name, p.role])).toEqual([
      ['Power-down order', 'reviewer'],
      ['Power-up order', 'reviewer'],
    ]);
    const outsider = new ApiClient(server.url);
    await outsider.register(uniqueEmail('outsider'), TEST_PASSWORD);
    expect((await outsider.get('/api/plans')).body).toEqual([]);
    expect((await outsider.get(`/api/plans/${planId}`)).status).toBe(404);
  });

  test('override viewer → editor on one plan → may rename that plan only', async () => {
    const set = await t.clients.owner.put(`/api/plans/${planId}/roles/${t.userIds.viewer}`, {
      role: 'editor',
    });
    expect(set.status).toBe(204);
    const renamed = await t.clients.viewer.patch<PlanSummaryDto>(`/api/plans/${planId}`, {
      name: 'Power-up order (checked)',
    });
    expect(renamed.status).toBe(200);
    expect(renamed.body.role).toBe('editor');
    expect((await t.clients.viewer.patch(`/api/plans/${otherPlanId}`, { name: 'x' })).status).toBe(
      403,
    );
    expect(await server.access.effectivePlanRole(t.userIds.viewer, planId)).toBe('editor');
    expect(await server.access.effectivePlanRole(t.userIds.viewer, otherPlanId)).toBe('viewer');
  });

  test('override editor → viewer → editing refused; clearing it restores editing', async () => {
    await t.clients.owner.put(`/api/plans/${planId}/roles/${t.userIds.editor}`, { role: 'viewer' });
    expect((await t.clients.editor.patch(`/api/plans/${planId}`, { name: 'y' })).status).toBe(403);
    expect(
      (await t.clients.owner.delete(`/api/plans/${planId}/roles/${t.userIds.editor}`)).status,
    ).toBe(204);
    expect(
      (await t.clients.editor.patch(`/api/plans/${planId}`, { name: 'Power-up order' })).status,
    ).toBe(200);
  });

  test('override to owner → 400 naming role; override for a non-member → 404', async () => {
    const owner = await t.clients.owner.put(`/api/plans/${planId}/roles/${t.userIds.viewer}`, {
      role: 'owner',
    });
    expect(owner.status).toBe(400);
    expect(owner.body).toMatchObject({ error: { fields: [{ path: 'role' }] } });
    const stranger = await t.clients.owner.put(
      `/api/plans/${planId}/roles/00000000-0000-4000-8000-000000000000`,
      { role: 'editor' },
    );
    expect(stranger.status).toBe(404);
  });

  test('a member who leaves the team → no role on its plans, override or not', async () => {
    await t.clients.viewer.delete(`/api/teams/${t.teamId}/members/${t.userIds.viewer}`);
    expect(await server.access.effectivePlanRole(t.userIds.viewer, planId)).toBeNull();
    expect((await t.clients.viewer.get(`/api/plans/${planId}`)).status).toBe(404);
  });

  test('owner deletes a plan → 204 and gone for everyone', async () => {
    expect((await t.clients.owner.delete(`/api/plans/${otherPlanId}`)).status).toBe(204);
    expect((await t.clients.editor.get(`/api/plans/${otherPlanId}`)).status).toBe(404);
  });
});
