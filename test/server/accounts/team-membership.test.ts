import type { MemberDto, Role } from '@rampart/collab/api/accounts';
import { ApiClient } from '../../utils/api-client';
import { startTestServer, type TestServer } from '../../utils/test-server';
import { createTeamWithAllRoles, type TeamFixture } from './team-fixture';

// Each file starts a real server with a fresh database; on a shared 2-core machine that can
// take longer than jest's 5 s default.
jest.setTimeout(30_000);

describe('members, roles and the last owner', () => {
  let server: TestServer;
  let t: TeamFixture;
  const events: string[] = [];
  beforeAll(async () => {
    server = await startTestServer();
    t = await createTeamWithAllRoles(server.url, 'Motor-drive controller team');
    server.events.on('membershipChanged', (userId, teamId, role) =>
      events.push(`${userId} ${teamId} ${role}`),
    );
  });
  afterAll(async () => {
    await server.stop();
  });

  const members = async (c: ApiClient): Promise<Record<string, Role>> => {
    const res = await c.get<MemberDto[]>(`/api/teams/${t.teamId}/members`);
    return Object.fromEntries(res.body.map((m) => [m.userId, m.role]));
  };

  test('GET members → one row per member with their role, for every member', async () => {
    const seen = await members(t.clients.viewer);
    expect(seen).toEqual({
      [t.userIds.owner]: 'owner',
      [t.userIds.editor]: 'editor',
      [t.userIds.reviewer]: 'reviewer',
      [t.userIds.viewer]: 'viewer',
    });
  });

  test('the only owner demotes themself → 409 with a message; still owner', async () => {
    const res = await t.clients.owner.patch(`/api/teams/${t.teamId}/members/${t.userIds.owner}`, {
      role: 'editor',
    });
    expect(res.status).toBe(409);
    expect(res.body).toEqual({
      error: {
        code: 'conflict',
        message: 'The last owner of a team cannot be demoted; make another member an owner first',
      },
    });
    expect((await members(t.clients.owner))[t.userIds.owner]).toBe('owner');
  });

  test('the only owner leaves → 409 with a message; still a member', async () => {
    const res = await t.clients.owner.delete(`/api/teams/${t.teamId}/members/${t.userIds.owner}`);
    expect(res.status).toBe(409);
    expect(res.body).toMatchObject({
      error: {
        code: 'conflict',
        message:
          'You are the last owner of this team and cannot leave it; make another member an owner first',
      },
    });
  });

  test('promote the editor to owner → 200 and an access event; then the first owner may step down', async () => {
    const res = await t.clients.owner.patch<MemberDto>(
      `/api/teams/${t.teamId}/members/${t.userIds.editor}`,
      { role: 'owner' },
    );
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ userId: t.userIds.editor, role: 'owner' });
    expect(events).toContain(`${t.userIds.editor} ${t.teamId} owner`);
    const down = await t.clients.owner.patch(`/api/teams/${t.teamId}/members/${t.userIds.owner}`, {
      role: 'editor',
    });
    expect(down.status).toBe(200);
    // Now the former editor is the last owner and the same rule protects them.
    const last = await t.clients.editor.patch(
      `/api/teams/${t.teamId}/members/${t.userIds.editor}`,
      {
        role: 'viewer',
      },
    );
    expect(last.status).toBe(409);
  });

  test('a viewer leaves → 204, gone from the list, team gone from their /me', async () => {
    const res = await t.clients.viewer.delete(`/api/teams/${t.teamId}/members/${t.userIds.viewer}`);
    expect(res.status).toBe(204);
    expect(events).toContain(`${t.userIds.viewer} ${t.teamId} null`);
    expect((await t.clients.viewer.me()).body.memberships).toEqual([]);
    expect((await t.clients.viewer.get(`/api/teams/${t.teamId}`)).status).toBe(404);
  });

  test('a reviewer removes someone else → 403 forbidden naming the role', async () => {
    const res = await t.clients.reviewer.delete(
      `/api/teams/${t.teamId}/members/${t.userIds.owner}`,
    );
    expect(res.status).toBe(403);
    expect(res.body).toEqual({
      error: {
        code: 'forbidden',
        message: 'Your role (reviewer) does not allow team:manage-members',
      },
    });
  });

  test('role change to a role that does not exist → 400 naming the role field', async () => {
    const res = await t.clients.editor.patch(
      `/api/teams/${t.teamId}/members/${t.userIds.reviewer}`,
      {
        role: 'admin',
      },
    );
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({
      error: { code: 'validation_failed', fields: [{ path: 'role' }] },
    });
  });

  test('two owners demote each other at the same moment → at least one owner remains', async () => {
    await t.clients.editor.patch(`/api/teams/${t.teamId}/members/${t.userIds.owner}`, {
      role: 'owner',
    });
    const [a, b] = await Promise.all([
      t.clients.owner.patch(`/api/teams/${t.teamId}/members/${t.userIds.editor}`, {
        role: 'viewer',
      }),
      t.clients.editor.patch(`/api/teams/${t.teamId}/members/${t.userIds.owner}`, {
        role: 'viewer',
      }),
    ]);
    // One wins; the other finds either the last-owner guard (409) or that it was demoted
    // first and may no longer manage members (403).
    const statuses = [a.status, b.status].sort();
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const owners = Object.values(await members(t.clients.reviewer)).filter((r) => r === 'owner');
    expect(owners).toHaveLength(1);
  });
});
