import type { DataSource } from 'typeorm';

import { PlanEntity } from './entities/plan.entity';

/** The demo scenario's catalogue entry. Its content is filled in by the plan document work. */
export const DEMO_PLAN = {
  slug: 'motor-drive-controller',
  name: 'Motor-drive controller — power-up and power-down',
  description:
    '24 V input; 5 V buck with soft-start; 3.3 V LDO enabled from the 5 V power-good through an RC ' +
    'delay; 1.2 V core regulator enabled when 3.3 V is in regulation; reset supervisor on 1.2 V and ' +
    '3.3 V; 2.5 V reference whose RC-filtered copy sets an enable threshold through a divider.',
};

/**
 * Inserts the demo data when missing. Idempotent: keyed by stable slugs, so a second start keeps
 * what is there (including user edits) and adds no duplicates.
 */
export async function seedDemo(dataSource: DataSource): Promise<{ created: string[] }> {
  const created: string[] = [];
  await dataSource.transaction(async (m) => {
    const result = await m
      .createQueryBuilder()
      .insert()
      .into(PlanEntity)
      .values(DEMO_PLAN)
      .orIgnore()
      .returning(['id'])
      .execute();
    if (result.raw.length > 0) created.push(`plan ${DEMO_PLAN.slug}`);
  });
  return { created };
}

/** Lines `npm start` prints about signing in to the demo. */
export const DEMO_SIGN_IN: readonly string[] = [
  'Demo plan: "Motor-drive controller" (accounts and demo users arrive with team accounts).',
];
