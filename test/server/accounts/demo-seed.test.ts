import type { MeResponse, PlanSummaryDto } from '@rampart/collab/api/accounts';
import {
  DEMO_PASSWORD,
  DEMO_PLAN,
  DEMO_SIGN_IN,
  DEMO_TEAM,
  DEMO_USERS,
  seedDemo,
} from '../../../server/data-access/seed';
import { ApiClient } from '../../utils/api-client';
import { startTestServer, type TestServer } from '../../utils/test-server';

// Each file starts a real server with a fresh database; on a shared 2-core machine that can
// take longer than jest's 5 s default.
jest.setTimeout(30_000);

describe('demo team and users', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ SEED_DEMO: 'true' });
  });
  afterAll(async () => {
    await server.stop();
  });

  test('each demo user signs in with the documented password and has their role', async () => {
    for (const u of DEMO_USERS) {
      const c = new ApiClient(server.url);
      const me: MeResponse = await c.signIn(u.email, DEMO_PASSWORD);
      expect(me.memberships).toEqual([
        { teamId: expect.any(String), teamName: DEMO_TEAM.name, role: u.role },
      ]);
      const plans = await c.get<PlanSummaryDto[]>('/api/plans');
      expect(plans.body.map((p) => [p.slug, p.role])).toEqual([[DEMO_PLAN.slug, u.role]]);
    }
    expect(DEMO_USERS.map((u) => u.role)).toEqual(['owner', 'editor', 'reviewer', 'viewer']);
  });

  test('seeding again → creates nothing, keeps a changed role', async () => {
    const viewer = DEMO_USERS[3];
    await server.dataSource.query(
      `UPDATE memberships SET role = 'reviewer'
        WHERE user_id = (SELECT id FROM users WHERE email = $1)`,
      [viewer?.email],
    );
    expect((await seedDemo(server.dataSource)).created).toEqual([]);
    const rows: Array<{ role: string }> = await server.dataSource.query(
      `SELECT m.role FROM memberships m JOIN users u ON u.id = m.user_id WHERE u.email = $1`,
      [viewer?.email],
    );
    expect(rows).toEqual([{ role: 'reviewer' }]);
    const counts: Array<{ users: string; teams: string; plans: string }> =
      await server.dataSource.query(
        'SELECT (SELECT count(*) FROM users) AS users, (SELECT count(*) FROM teams) AS teams, (SELECT count(*) FROM plans) AS plans',
      );
    expect(counts[0]).toEqual({ users: '4', teams: '1', plans: '1' });
  });

  test('DEMO_SIGN_IN (printed by npm start) → lists every demo e-mail and the password', () => {
    const text = DEMO_SIGN_IN.join('\n');
    for (const u of DEMO_USERS) expect(text).toContain(u.email);
    expect(text).toContain(DEMO_PASSWORD);
  });
});
