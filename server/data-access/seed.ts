import bcrypt from 'bcryptjs';
import type { DataSource, EntityManager } from 'typeorm';

import type { Role } from '@rampart/collab/api/accounts';
import { demoPlanUpdate } from '@rampart/collab/doc/demo-plan';
import { MembershipEntity } from './entities/membership.entity';
import { PlanEntity } from './entities/plan.entity';
import { TeamEntity } from './entities/team.entity';
import { UserEntity } from './entities/user.entity';
import { seedPlanDocument } from './repositories/plan-document-seed';

/** The demo scenario's catalogue entry. Its content is filled in by the plan document work. */
export const DEMO_PLAN = {
  slug: 'motor-drive-controller',
  name: 'Motor-drive controller — power-up and power-down',
  description:
    '24 V input; 5 V buck with soft-start; 3.3 V LDO enabled from the 5 V power-good through an RC ' +
    'delay; 1.2 V core regulator enabled when 3.3 V is in regulation; reset supervisor on 1.2 V and ' +
    '3.3 V; 2.5 V reference whose RC-filtered copy sets an enable threshold through a divider.',
};

/** The team that owns the demo plan. */
export const DEMO_TEAM = {
  slug: 'motor-drive-controller-team',
  name: 'Motor-drive controller team',
};

/** Password of every demo user. For local use only: it is published in the README. */
export const DEMO_PASSWORD = 'rampart-demo';

/** One demo user per team role. */
export const DEMO_USERS: ReadonlyArray<{ email: string; name: string; role: Role }> = [
  { email: 'olivia.owner@rampart.test', name: 'Olivia Owner', role: 'owner' },
  { email: 'eddie.editor@rampart.test', name: 'Eddie Editor', role: 'editor' },
  { email: 'rita.reviewer@rampart.test', name: 'Rita Reviewer', role: 'reviewer' },
  { email: 'vic.viewer@rampart.test', name: 'Vic Viewer', role: 'viewer' },
];

/**
 * Inserts the demo data when missing: the demo team, one user per role, and the demo plan in
 * that team. Idempotent: keyed by slugs and e-mails, so a second start keeps what is there
 * (including user edits, changed roles and passwords) and adds no duplicates.
 */
export async function seedDemo(
  dataSource: DataSource,
  options: { bcryptCost?: number } = {},
): Promise<{ created: string[] }> {
  const created: string[] = [];
  await dataSource.transaction(async (m) => {
    const team = await insertMissing(m, TeamEntity, DEMO_TEAM, 'slug');
    if (team.created) created.push(`team ${DEMO_TEAM.slug}`);
    const plan = await insertMissing(m, PlanEntity, { ...DEMO_PLAN, teamId: team.id }, 'slug');
    if (plan.created) created.push(`plan ${DEMO_PLAN.slug}`);
    // The plan's live document: seeded once, never over edits (see plan-document-seed.ts).
    if (await seedPlanDocument(m, plan.id, demoPlanUpdate())) created.push('demo plan document');

    const cost = options.bcryptCost ?? 10;
    for (const u of DEMO_USERS) {
      const existing = await m.findOneBy(UserEntity, { email: u.email });
      const user =
        existing ??
        (await m.save(
          UserEntity,
          m.create(UserEntity, {
            email: u.email,
            name: u.name,
            passwordHash: await bcrypt.hash(DEMO_PASSWORD, cost),
          }),
        ));
      if (!existing) created.push(`user ${u.email}`);
      // A new user joins with the demo role; an existing membership keeps its (maybe changed) role.
      await m
        .createQueryBuilder()
        .insert()
        .into(MembershipEntity)
        .values({ teamId: team.id, userId: user.id, role: u.role })
        .orIgnore()
        .execute();
    }
  });
  return { created };
}

async function insertMissing<T extends { id: string }>(
  m: EntityManager,
  entity: new () => T,
  values: Partial<T> & Record<string, unknown>,
  key: string,
): Promise<{ id: string; created: boolean }> {
  const result = await m
    .createQueryBuilder()
    .insert()
    .into(entity)
    .values(values as never)
    .orIgnore()
    .returning(['id'])
    .execute();
  const inserted = (result.raw as Array<{ id: string }>)[0];
  if (inserted) return { id: inserted.id, created: true };
  const row = await m.findOneByOrFail(entity, { [key]: values[key] } as never);
  return { id: row.id, created: false };
}

/** Lines `npm start` prints about signing in to the demo. */
export const DEMO_SIGN_IN: readonly string[] = [
  `Demo team "${DEMO_TEAM.name}", plan "${DEMO_PLAN.name}".`,
  `Demo users (password "${DEMO_PASSWORD}", local use only):`,
  ...DEMO_USERS.map((u) => `  ${u.role.padEnd(8)} ${u.email}`),
];
