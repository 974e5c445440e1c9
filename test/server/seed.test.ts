import { openDatabase } from '../../server/data-access/data-source';
import { DEMO_PLAN, seedDemo } from '../../server/data-access/seed';
import { createTestDatabase, type TestDatabase } from '../utils/test-database';

describe('seedDemo', () => {
  let db: TestDatabase;
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(async () => {
    await db.drop();
  });

  test('run twice → one demo plan, second run creates nothing and keeps edits', async () => {
    const { dataSource, applied } = await openDatabase(db.url);
    try {
      expect(applied.length).toBeGreaterThan(0);
      expect((await seedDemo(dataSource)).created).toContain(`plan ${DEMO_PLAN.slug}`);
      await dataSource.query(`UPDATE plans SET name = 'Edited by a user' WHERE slug = $1`, [
        DEMO_PLAN.slug,
      ]);
      expect((await seedDemo(dataSource)).created).toEqual([]);
      const rows: Array<{ name: string }> = await dataSource.query('SELECT name FROM plans');
      expect(rows).toEqual([{ name: 'Edited by a user' }]);
    } finally {
      await dataSource.destroy();
    }
  });

  test('migrations on an up-to-date database → nothing applied', async () => {
    const { dataSource, applied } = await openDatabase(db.url);
    await dataSource.destroy();
    expect(applied).toEqual([]);
  });
});
