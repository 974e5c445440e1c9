/**
 * The authorization matrix: every API route × every actor → the expected status, from one
 * table. A route the application serves without an entry here fails the inventory test, so a
 * new route cannot ship without its permissions being decided.
 */
import { ACCOUNTS_ROUTES, type Role } from '@rampart/collab/api/accounts';
import { ApiClient } from '../../utils/api-client';
import { startTestServer, type TestServer } from '../../utils/test-server';
import { apiRoutes } from './route-inventory';
import {
  createTeamWithAllRoles,
  insertMember,
  inviteAndGetToken,
  TEST_PASSWORD,
  uniqueEmail,
  type TeamFixture,
} from './team-fixture';

// Each file starts a real server with a fresh database; on a shared 2-core machine that can
// take longer than jest's 5 s default.
jest.setTimeout(30_000);

type Actor = Role | 'non-member' | 'signed-out';
const ACTORS: readonly Actor[] = [
  'owner',
  'editor',
  'reviewer',
  'viewer',
  'non-member',
  'signed-out',
];

interface Ctx {
  server: TestServer;
  team: TeamFixture;
  planId: string;
  /** A member (viewer) that role and override changes target. */
  spareId: string;
  /** A named version of the plan (made by the owner on first use). */
  snapshotId(): Promise<string>;
  emailOf(actor: Actor): string;
  clientOf(actor: Actor): ApiClient;
  /** A client signed in afresh as `actor` (for routes that end or replace the session). */
  freshClient(actor: Actor): Promise<ApiClient>;
  refreshClients(): Promise<void>;
}

interface Row {
  /** `METHOD /api/path` exactly as the router declares it. */
  route: string;
  /** Values for the `:params` of the path, per cell (may create a fresh target). */
  params?: (ctx: Ctx, actor: Actor) => Promise<Record<string, string>> | Record<string, string>;
  body?: (ctx: Ctx, actor: Actor) => unknown;
  /** Query string (without `?`) appended to the path. */
  query?: (ctx: Ctx) => Promise<string>;
  /** Use a freshly signed-in client for each cell: the route ends or replaces the session. */
  fresh?: boolean;
  /** Restores the fixture after the whole row ran. */
  after?: (ctx: Ctx) => Promise<void>;
  expect: Record<Actor, number>;
}

/** Same status for every actor. */
const all = (status: number): Record<Actor, number> =>
  Object.fromEntries(ACTORS.map((a) => [a, status])) as Record<Actor, number>;
/** Signed in → `status`, signed out → 401. */
const signedIn = (status: number): Record<Actor, number> => ({ ...all(status), 'signed-out': 401 });
/** Team members → `member`, non-member 404, signed out 401; per-role exceptions in `roles`. */
const team = (
  member: number,
  roles: Partial<Record<Role, number>> = {},
): Record<Actor, number> => ({
  owner: member,
  editor: member,
  reviewer: member,
  viewer: member,
  ...roles,
  'non-member': 404,
  'signed-out': 401,
});
const ownerOnly = (status: number): Record<Actor, number> => team(403, { owner: status });

const freshPlan = async (ctx: Ctx): Promise<string> => {
  const res = await ctx.team.clients.owner.post<{ id: string }>('/api/plans', {
    teamId: ctx.team.teamId,
    name: 'Throwaway plan',
  });
  return res.body.id;
};

const MATRIX: Row[] = [
  { route: 'GET /api/health', expect: all(200) },
  { route: 'GET /api/auth/csrf', expect: all(200) },
  {
    route: 'POST /api/auth/register',
    fresh: true,
    body: () => ({ email: uniqueEmail('new'), password: TEST_PASSWORD }),
    expect: all(201),
  },
  {
    route: 'POST /api/auth/sign-in',
    fresh: true,
    body: (ctx, a) => ({
      email: ctx.emailOf(a === 'signed-out' ? 'viewer' : a),
      password: TEST_PASSWORD,
    }),
    expect: all(200),
  },
  { route: 'POST /api/auth/sign-out', fresh: true, expect: all(204) },
  { route: 'GET /api/auth/me', expect: signedIn(200) },
  {
    route: 'POST /api/auth/password',
    fresh: true,
    body: () => ({ currentPassword: TEST_PASSWORD, newPassword: TEST_PASSWORD }),
    // Changing the password ends the user's other sessions, the shared clients included.
    after: (ctx) => ctx.refreshClients(),
    expect: signedIn(204),
  },
  {
    route: 'POST /api/auth/password-reset',
    body: () => ({ email: 'nobody@example.test' }),
    expect: all(202),
  },
  {
    route: 'POST /api/auth/password-reset/confirm',
    body: () => ({ token: 'A'.repeat(43), password: TEST_PASSWORD }),
    expect: all(422),
  },
  { route: 'GET /api/teams', expect: signedIn(200) },
  { route: 'POST /api/teams', body: () => ({ name: 'Another team' }), expect: signedIn(201) },
  { route: 'GET /api/teams/:teamId', expect: team(200) },
  { route: 'GET /api/teams/:teamId/members', expect: team(200) },
  {
    route: 'PATCH /api/teams/:teamId/members/:userId',
    params: (ctx) => ({ userId: ctx.spareId }),
    body: () => ({ role: 'viewer' }),
    expect: ownerOnly(200),
  },
  {
    route: 'DELETE /api/teams/:teamId/members/:userId',
    params: async (ctx) => ({
      userId: await insertMember(ctx.server.dataSource, ctx.team.teamId, 'viewer'),
    }),
    expect: ownerOnly(204),
  },
  { route: 'GET /api/teams/:teamId/invitations', expect: ownerOnly(200) },
  {
    route: 'POST /api/teams/:teamId/invitations',
    body: () => ({ email: uniqueEmail('invitee'), role: 'viewer' }),
    expect: ownerOnly(201),
  },
  {
    route: 'DELETE /api/teams/:teamId/invitations/:invitationId',
    params: async (ctx) => {
      const { invitationId } = await inviteAndGetToken(
        ctx.team.clients.owner,
        ctx.team.teamId,
        uniqueEmail('withdrawn'),
        'viewer',
      );
      return { invitationId };
    },
    expect: ownerOnly(204),
  },
  {
    route: 'GET /api/invitations/:token',
    params: async (ctx) => ({
      token: (
        await inviteAndGetToken(
          ctx.team.clients.owner,
          ctx.team.teamId,
          uniqueEmail('look'),
          'viewer',
        )
      ).token,
    }),
    expect: all(200),
  },
  {
    route: 'POST /api/invitations/:token/accept',
    // Members hold someone else's invitation (403: not their address); the non-member is
    // invited at their own address and joins (200); a signed-out visitor must sign in (401).
    params: async (ctx, a) => ({
      token: (
        await inviteAndGetToken(
          ctx.team.clients.owner,
          ctx.team.teamId,
          a === 'non-member' ? ctx.emailOf(a) : uniqueEmail('someone-else'),
          'viewer',
        )
      ).token,
    }),
    after: async (ctx) => {
      const nonMemberId = (await ctx.clientOf('non-member').me()).body.user.id;
      await ctx.team.clients.owner.delete(`/api/teams/${ctx.team.teamId}/members/${nonMemberId}`);
    },
    expect: { ...team(403), 'non-member': 200 },
  },
  { route: 'GET /api/plans', expect: signedIn(200) },
  {
    route: 'POST /api/plans',
    body: (ctx) => ({ teamId: ctx.team.teamId, name: 'New plan' }),
    expect: team(403, { owner: 201, editor: 201 }),
  },
  { route: 'GET /api/plans/:planId', expect: team(200) },
  {
    route: 'PATCH /api/plans/:planId',
    body: () => ({ name: 'Motor-drive controller — renamed' }),
    expect: team(403, { owner: 200, editor: 200 }),
  },
  {
    route: 'DELETE /api/plans/:planId',
    params: async (ctx) => ({ planId: await freshPlan(ctx) }),
    expect: ownerOnly(204),
  },
  {
    route: 'PUT /api/plans/:planId/roles/:userId',
    params: (ctx) => ({ userId: ctx.spareId }),
    body: () => ({ role: 'reviewer' }),
    expect: ownerOnly(204),
  },
  {
    route: 'DELETE /api/plans/:planId/roles/:userId',
    params: (ctx) => ({ userId: ctx.spareId }),
    expect: ownerOnly(204),
  },

  // Named versions of a plan (live-plan relay, server/collab/http/snapshots-router.ts).
  { route: 'GET /api/plans/:planId/snapshots', expect: team(200) },
  {
    route: 'POST /api/plans/:planId/snapshots',
    body: () => ({ message: 'Before the 3V3 delay change' }),
    expect: team(403, { owner: 201, editor: 201 }),
  },
  {
    route: 'POST /api/plans/:planId/snapshots/:snapshotId/restore',
    params: async (ctx) => ({ snapshotId: await ctx.snapshotId() }),
    expect: team(403, { owner: 200, editor: 200 }),
  },
  {
    route: 'GET /api/plans/:planId/snapshots/compare',
    query: async (ctx) => `from=${await ctx.snapshotId()}&to=current`,
    expect: team(200),
  },
];

function fillPath(route: string, values: Record<string, string>): string {
  const path = route.split(' ')[1] ?? '';
  return path.replace(/:([A-Za-z]+)/g, (_m, name: string) => {
    const v = values[name];
    if (v === undefined) throw new Error(`${route}: no value for :${name}`);
    return v;
  });
}

describe('authorization matrix', () => {
  let ctx: Ctx;
  const outcomes: string[] = [];

  beforeAll(async () => {
    const server = await startTestServer({ AUTH_RATE_LIMIT: '100000' });
    const teamFixture = await createTeamWithAllRoles(server.url, 'Matrix team');
    const outsiderEmail = uniqueEmail('outsider');
    const outsider = new ApiClient(server.url);
    await outsider.register(outsiderEmail, TEST_PASSWORD, 'Outsider');
    // The outsider has a team of their own, so "non-member" is not just "has no team".
    await outsider.post('/api/teams', { name: 'Outsider team' });
    const anonymous = new ApiClient(server.url);
    const plan = await teamFixture.clients.owner.post<{ id: string }>('/api/plans', {
      teamId: teamFixture.teamId,
      name: 'Motor-drive controller',
    });
    const clients: Record<Actor, ApiClient> = {
      ...teamFixture.clients,
      'non-member': outsider,
      'signed-out': anonymous,
    };
    const emailOf = (a: Actor): string =>
      a === 'non-member' ? outsiderEmail : a === 'signed-out' ? '' : teamFixture.emails[a];
    const freshClient = async (a: Actor): Promise<ApiClient> => {
      const c = new ApiClient(server.url);
      if (a !== 'signed-out') await c.signIn(emailOf(a), TEST_PASSWORD);
      return c;
    };
    let snapshot: string | undefined;
    ctx = {
      snapshotId: async () => {
        if (!snapshot) {
          const res = await teamFixture.clients.owner.post<{ id: string }>(
            `/api/plans/${plan.body.id}/snapshots`,
            { message: 'Matrix baseline' },
          );
          if (res.status !== 201)
            throw new Error(`snapshot → ${res.status} ${JSON.stringify(res.body)}`);
          snapshot = res.body.id;
        }
        return snapshot;
      },
      server,
      team: teamFixture,
      planId: plan.body.id,
      spareId: await insertMember(server.dataSource, teamFixture.teamId, 'viewer'),
      emailOf,
      clientOf: (a) => clients[a],
      freshClient,
      refreshClients: async () => {
        for (const a of ACTORS) {
          if (a !== 'signed-out') {
            clients[a] = await freshClient(a);
            if (a in teamFixture.clients) teamFixture.clients[a as Role] = clients[a];
          }
        }
      },
    };
  }, 120_000);

  afterAll(async () => {
    await ctx.server.stop();
  });

  test('every /api route the router serves has a row, and every row is a real route', () => {
    const served = apiRoutes(ctx.server.app);
    const listed = MATRIX.map((r) => r.route).sort();
    expect(served.filter((r) => !listed.includes(r))).toEqual([]);
    expect(listed.filter((r) => !served.includes(r))).toEqual([]);
    expect(new Set(listed).size).toBe(listed.length);
  });

  test('every route of the accounts contract (collab/api/accounts.ts) is served', () => {
    const served = apiRoutes(ctx.server.app);
    expect(ACCOUNTS_ROUTES.filter((r) => !served.includes(r))).toEqual([]);
  });

  test('route × actor → expected status, zero unexpected allows or denials', async () => {
    for (const row of MATRIX) {
      for (const actor of ACTORS) {
        const params = {
          teamId: ctx.team.teamId,
          planId: ctx.planId,
          ...(await row.params?.(ctx, actor)),
        };
        const client = row.fresh ? await ctx.freshClient(actor) : ctx.clientOf(actor);
        const [method = 'GET'] = row.route.split(' ');
        const query = row.query ? `?${await row.query(ctx)}` : '';
        const res = await client.request(
          method,
          fillPath(row.route, params) + query,
          row.body?.(ctx, actor),
        );
        if (res.status !== row.expect[actor]) {
          outcomes.push(
            `${row.route} as ${actor}: expected ${row.expect[actor]}, got ${res.status} ${JSON.stringify(res.body)}`,
          );
        }
      }
      await row.after?.(ctx);
    }
    expect(outcomes).toEqual([]);
  }, 120_000);
});
