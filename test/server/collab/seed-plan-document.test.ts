import * as Y from 'yjs';

import { demoPlanUpdate } from '@rampart/collab/doc/demo-plan';
import { docToPlan } from '@rampart/collab/doc/doc-to-plan';

import { seedPlanDocument } from '../../../server/data-access/repositories/plan-document-seed';
import { openDatabase } from '../../../server/data-access/data-source';
import { PlanDocumentRepository } from '../../../server/data-access/repositories/plan-document-repository';
import { createPlanRow } from '../../utils/collab-test-server';
import { createTestDatabase, type TestDatabase } from '../../utils/test-database';
import type { DataSource } from 'typeorm';

describe('seedPlanDocument', () => {
  let db: TestDatabase;
  let dataSource: DataSource;

  beforeAll(async () => {
    db = await createTestDatabase();
    ({ dataSource } = await openDatabase(db.url));
  });

  afterAll(async () => {
    await dataSource.destroy();
    await db.drop();
  });

  function loadDoc(planId: string): Promise<Y.Doc> {
    return new PlanDocumentRepository(dataSource).load(planId).then((stored) => {
      const doc = new Y.Doc();
      Y.applyUpdate(doc, stored.state);
      for (const u of stored.updates) Y.applyUpdate(doc, u.update);
      return doc;
    });
  }

  it('seedPlanDocument(demo) twice → seeded once, the stored doc reads as the demo plan', async () => {
    const planId = await createPlanRow(dataSource, 'seed-demo');
    expect(await seedPlanDocument(dataSource, planId, demoPlanUpdate())).toBe(true);
    expect(await seedPlanDocument(dataSource, planId, demoPlanUpdate())).toBe(false);
    const plan = docToPlan(await loadDoc(planId));
    // Parts of the demo scenario (collab/engine/examples/motor-drive.json), not duplicated.
    expect(plan.parts.filter((p) => p.id === 'R1')).toHaveLength(1);
    expect(plan.parts.length).toBeGreaterThan(5);
  });

  it('plan already edited live → seedPlanDocument leaves it alone', async () => {
    const planId = await createPlanRow(dataSource, 'seed-edited');
    const doc = new Y.Doc();
    doc.getMap('meta').set('name', 'Edited first');
    await new PlanDocumentRepository(dataSource).append(planId, [
      { update: Y.encodeStateAsUpdate(doc), authorId: null },
    ]);
    expect(await seedPlanDocument(dataSource, planId, demoPlanUpdate())).toBe(false);
    expect((await loadDoc(planId)).getMap('parts').size).toBe(0);
  });
});
