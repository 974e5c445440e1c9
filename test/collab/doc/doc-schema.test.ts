import * as Y from 'yjs';

import { docToPlan } from '@rampart/collab/doc/doc-to-plan';
import { META, metaMap, RANK_KEY, collection } from '@rampart/collab/doc/doc-layout';
import {
  assertDocReadable,
  DOC_SCHEMA_VERSION,
  docSchemaVersion,
  migrateDoc,
} from '@rampart/collab/doc/doc-schema';
import { DocSchemaError } from '@rampart/collab/doc/plan-edit-error';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';

import { smallPlan } from './fixtures';

/** A doc as written before the layout version existed: no version, no ranks. */
function legacyDoc(): Y.Doc {
  const doc = planToDoc(smallPlan());
  doc.transact(() => {
    metaMap(doc).delete(META.docSchemaVersion);
    for (const entry of collection(doc, 'parts').values()) entry.delete(RANK_KEY);
  });
  return doc;
}

describe('doc schema version and migrateDoc', () => {
  test('planToDoc → doc stamped with the current layout version', () => {
    expect(docSchemaVersion(planToDoc(smallPlan()))).toBe(DOC_SCHEMA_VERSION);
  });

  test('migrateDoc(current doc) → no steps, no write', () => {
    const doc = planToDoc(smallPlan());
    const before = Y.encodeStateVector(doc);
    expect(migrateDoc(doc)).toEqual({ from: 1, to: 1, steps: [] });
    expect(Y.encodeStateVector(doc)).toEqual(before);
  });

  test('migrateDoc(version-0 doc without ranks) → version 1, parts ranked by id, plan intact', () => {
    const doc = legacyDoc();
    expect(docSchemaVersion(doc)).toBe(0);
    const report = migrateDoc(doc);
    expect(report.from).toBe(0);
    expect(report.to).toBe(1);
    expect(report.steps).toHaveLength(1);
    expect(docSchemaVersion(doc)).toBe(1);
    const plan = docToPlan(doc);
    expect(plan.parts.map((p) => p.id)).toEqual(
      smallPlan()
        .parts.map((p) => p.id)
        .sort(),
    );
    expect([...plan.parts].sort((a, b) => a.id.localeCompare(b.id))).toEqual(
      [...smallPlan().parts].sort((a, b) => a.id.localeCompare(b.id)),
    );
  });

  test('two replicas migrating the same legacy doc at once → identical after merge', () => {
    const legacy = Y.encodeStateAsUpdate(legacyDoc());
    const a = new Y.Doc();
    const b = new Y.Doc();
    Y.applyUpdate(a, legacy);
    Y.applyUpdate(b, legacy);
    migrateDoc(a);
    migrateDoc(b);
    Y.applyUpdate(a, Y.encodeStateAsUpdate(b));
    Y.applyUpdate(b, Y.encodeStateAsUpdate(a));
    expect(docToPlan(a)).toEqual(docToPlan(b));
    expect(docSchemaVersion(a)).toBe(1);
  });

  test('migrateDoc(empty doc) → left alone (nothing to migrate before the first sync)', () => {
    const doc = new Y.Doc();
    expect(migrateDoc(doc).steps).toEqual([]);
    expect(metaMap(doc).size).toBe(0);
  });

  test('a doc from a newer layout → DocSchemaError telling the user to reload', () => {
    const doc = planToDoc(smallPlan());
    metaMap(doc).set(META.docSchemaVersion, DOC_SCHEMA_VERSION + 1);
    expect(() => assertDocReadable(doc)).toThrow(DocSchemaError);
    expect(() => migrateDoc(doc)).toThrow(/layout 2 is newer .* reload the page/);
  });
});
