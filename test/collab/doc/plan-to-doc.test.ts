import * as Y from 'yjs';

import { docToPlan, readParts } from '@rampart/collab/doc/doc-to-plan';
import { readIntents } from '@rampart/collab/doc/drawn-intent';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';
import { DEMO_INTENTS, demoPlanUpdate } from '@rampart/collab/doc/demo-plan';
import { DocSchemaError } from '@rampart/collab/doc/plan-edit-error';
import { parsePlan } from '@rampart/collab/engine/plan/validate-plan';

import { motorDrivePlan, smallIntents, smallPlan } from './fixtures';

/** A replica built only from the encoded state, as a client receives it from the relay. */
function replicaOf(doc: Y.Doc): Y.Doc {
  const copy = new Y.Doc();
  Y.applyUpdate(copy, Y.encodeStateAsUpdate(doc));
  return copy;
}

describe('planToDoc / docToPlan', () => {
  test('planToDoc(motor-drive.json) → docToPlan returns the same plan, which the engine accepts', () => {
    const plan = motorDrivePlan();
    const back = docToPlan(planToDoc(plan));
    expect(back).toEqual(plan);
    expect(parsePlan(back)).toEqual(plan);
  });

  test('motor-drive plan through an encoded update → identical plan on the replica', () => {
    const plan = motorDrivePlan();
    expect(docToPlan(replicaOf(planToDoc(plan)))).toEqual(plan);
  });

  test('small plan with scenarios, settings, nested tolerances → round trip keeps order and fields', () => {
    const plan = smallPlan();
    const doc = replicaOf(planToDoc(plan, { intents: smallIntents() }));
    expect(docToPlan(doc)).toEqual(plan);
    expect(readParts(doc).map((p) => p.id)).toEqual(plan.parts.map((p) => p.id));
  });

  test('intents → readIntents returns them, points sorted by time', () => {
    const intents = smallIntents();
    intents.v5.points.push({ id: 'early', t: 0.0015, v: 2 });
    const doc = replicaOf(planToDoc(smallPlan(), { intents }));
    const read = readIntents(doc);
    expect(read.v33).toEqual(intents.v33);
    expect(read.v5.points.map((p) => p.id)).toEqual(['early', 'knee']);
  });

  test('empty settings object → read back as absent (engine defaults)', () => {
    const plan = { ...smallPlan(), settings: {} };
    expect(docToPlan(planToDoc(plan)).settings).toBeUndefined();
  });

  test('duplicate part id → DocSchemaError naming the part', () => {
    const plan = smallPlan();
    plan.parts.push({ ...plan.parts[2] });
    expect(() => planToDoc(plan)).toThrow(DocSchemaError);
    expect(() => planToDoc(plan)).toThrow('part RL5: id used twice');
  });

  test('intent for an unknown signal → DocSchemaError naming it', () => {
    const intents = { ghost: { start: 0, end: 1, level: 1, points: [] } };
    expect(() => planToDoc(smallPlan(), { intents })).toThrow('unknown signal ghost');
  });

  test('intent ending before it starts → DocSchemaError naming signal and field', () => {
    const intents = { v5: { start: 2, end: 1, level: 5, points: [] } };
    expect(() => planToDoc(smallPlan(), { intents })).toThrow(
      'intent of signal v5: end must not be before start',
    );
  });

  test('planToDoc into a doc that already holds a plan → DocSchemaError', () => {
    const doc = planToDoc(smallPlan());
    expect(() => planToDoc(smallPlan(), { doc })).toThrow('not empty');
  });

  test('docToPlan(empty doc) → empty plan skeleton, never a crash', () => {
    const plan = docToPlan(new Y.Doc());
    expect(plan).toEqual({
      schemaVersion: 1,
      name: '',
      nets: [],
      parts: [],
      signals: [],
      requirements: [],
    });
  });
});

describe('demo plan document', () => {
  test('demoPlanUpdate() → a doc whose plan is motor-drive.json and whose intents are the demo ones', () => {
    const doc = new Y.Doc();
    Y.applyUpdate(doc, demoPlanUpdate());
    expect(docToPlan(doc)).toEqual(motorDrivePlan());
    expect(readIntents(doc)).toEqual(
      Object.fromEntries(Object.entries(DEMO_INTENTS).sort(([a], [b]) => (a < b ? -1 : 1))),
    );
  });
});
