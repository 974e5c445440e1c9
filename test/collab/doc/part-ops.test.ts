import * as Y from 'yjs';

import { readEntry, readParts } from '@rampart/collab/doc/doc-to-plan';
import { localOrigin, REMOTE_ORIGIN } from '@rampart/collab/doc/doc-origin';
import { describeEdit, editOf, type EditRecord } from '@rampart/collab/doc/edit-record';
import {
  addPart,
  removePart,
  setPartField,
  setPartValue,
  setTolerance,
} from '@rampart/collab/doc/part-ops';
import { PlanEditError } from '@rampart/collab/doc/plan-edit-error';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';
import type { PartSpec } from '@rampart/collab/engine/plan/plan-schema-parts';

import { smallPlan } from './fixtures';

const ana = localOrigin('u-ana', 'Ana');
const ben = localOrigin('u-ben', 'Ben');

function part(doc: Y.Doc, id: string): PartSpec {
  const p = readEntry<PartSpec>(doc, 'parts', id);
  if (!p) throw new Error(`no part ${id}`);
  return p;
}

/** Two replicas of the same stored plan that exchange updates only when told to. */
function twoReplicas(): [Y.Doc, Y.Doc] {
  const seed = planToDoc(smallPlan());
  const a = new Y.Doc();
  const b = new Y.Doc();
  Y.applyUpdate(a, Y.encodeStateAsUpdate(seed), REMOTE_ORIGIN);
  Y.applyUpdate(b, Y.encodeStateAsUpdate(seed), REMOTE_ORIGIN);
  return [a, b];
}

function exchange(a: Y.Doc, b: Y.Doc): void {
  const toB = Y.encodeStateAsUpdate(a, Y.encodeStateVector(b));
  const toA = Y.encodeStateAsUpdate(b, Y.encodeStateVector(a));
  Y.applyUpdate(b, toB, REMOTE_ORIGIN);
  Y.applyUpdate(a, toA, REMOTE_ORIGIN);
}

describe('part ops', () => {
  test('setPartValue(R4, 120 k) → value changed, record says who and before/after', () => {
    const doc = planToDoc(smallPlan());
    const record = setPartValue(doc, ana, 'R4', 120_000);
    expect(part(doc, 'R4')).toMatchObject({ value: 120_000, tolerance: { percent: 1 } });
    expect(record).toEqual({
      op: 'setPartValue',
      userId: 'u-ana',
      userName: 'Ana',
      target: 'part',
      targetId: 'R4',
      field: 'value',
      before: 100_000,
      after: 120_000,
    });
    expect(describeEdit(record, 'Ω')).toBe('Ana changed part R4 value: 100 kΩ → 120 kΩ');
  });

  test('an op → its transaction carries the local origin and the edit record', () => {
    const doc = planToDoc(smallPlan());
    const seen: Array<{ origin: unknown; record: EditRecord | undefined }> = [];
    doc.on('afterTransaction', (tr: Y.Transaction) =>
      seen.push({ origin: tr.origin, record: editOf(tr) }),
    );
    setTolerance(doc, ana, 'C3', 'value', { percent: 20 });
    expect(seen).toHaveLength(1);
    expect(seen[0].origin).toBe(ana);
    expect(seen[0].record?.op).toBe('setTolerance');
  });

  test('setPartValue(R4, -5) → PlanEditError naming part R4 and field value; doc unchanged', () => {
    const doc = planToDoc(smallPlan());
    const before = Y.encodeStateVector(doc);
    expect(() => setPartValue(doc, ana, 'R4', -5)).toThrow(PlanEditError);
    expect(() => setPartValue(doc, ana, 'R4', -5)).toThrow(/^part R4 value: .*must be > 0/);
    expect(() => setPartValue(doc, ana, 'R4', Number.NaN)).toThrow(/part R4 value/);
    expect(Y.encodeStateVector(doc)).toEqual(before);
  });

  test('setPartValue on a regulator → PlanEditError: a regulator has no main value', () => {
    const doc = planToDoc(smallPlan());
    expect(() => setPartValue(doc, ana, 'U1', 5)).toThrow(
      'part U1 value: a regulator has no main value',
    );
  });

  test('setPartValue on an unknown part → PlanEditError naming it', () => {
    const doc = planToDoc(smallPlan());
    expect(() => setPartValue(doc, ana, 'R99', 1)).toThrow('part R99: no such id in this plan');
  });

  test('setPartField(U1, softStart, 3 ms) → changed; setPartField(U1, kind) → refused', () => {
    const doc = planToDoc(smallPlan());
    setPartField(doc, ana, 'U1', 'softStart', 0.003);
    expect(part(doc, 'U1')).toMatchObject({ softStart: 0.003 });
    expect(() => setPartField(doc, ana, 'U1', 'kind', 'resistor')).toThrow('part U1 kind');
    expect(() => setPartField(doc, ana, 'U1', 'vout', 'five')).toThrow(/part U1 vout/);
  });

  test('setTolerance(U1, softStart, 10 %) and clearing vout → nested tolerances updated', () => {
    const doc = planToDoc(smallPlan());
    setTolerance(doc, ana, 'U1', 'softStart', { percent: 10 });
    setTolerance(doc, ana, 'U1', 'vout', undefined);
    expect(part(doc, 'U1')).toMatchObject({ tolerances: { softStart: { percent: 10 } } });
    expect((part(doc, 'U1') as { tolerances?: object }).tolerances).not.toHaveProperty('vout');
  });

  test('setTolerance with both percent and min/max → PlanEditError naming the part', () => {
    const doc = planToDoc(smallPlan());
    expect(() =>
      setTolerance(doc, ana, 'R4', 'value', { percent: 1, min: 99_000, max: 101_000 }),
    ).toThrow(/^part R4 tolerance: tolerance needs either percent or min and max/);
  });

  test('setTolerance on a field that cannot vary → PlanEditError naming the field', () => {
    const doc = planToDoc(smallPlan());
    expect(() => setTolerance(doc, ana, 'U1', 'input', { percent: 1 })).toThrow(
      'part U1 tolerances: input is not a toleranced field',
    );
  });

  test('addPart then removePart → listed at the end, then gone; duplicate id refused', () => {
    const doc = planToDoc(smallPlan());
    addPart(doc, ana, { id: 'R9', kind: 'resistor', a: 'v33', b: '0', value: 4700 });
    expect(readParts(doc).at(-1)?.id).toBe('R9');
    expect(() =>
      addPart(doc, ana, { id: 'R9', kind: 'resistor', a: 'v33', b: '0', value: 1 }),
    ).toThrow('part R9: id already used in this plan');
    const record = removePart(doc, ana, 'R9');
    expect(readParts(doc).map((p) => p.id)).not.toContain('R9');
    expect(describeEdit(record)).toBe('Ana removed part R9');
  });

  test('concurrent setPartValue(R4) and setTolerance(R4) on two replicas → both kept after merge', () => {
    const [a, b] = twoReplicas();
    setPartValue(a, ana, 'R4', 150_000);
    setTolerance(b, ben, 'R4', 'value', { percent: 5 });
    exchange(a, b);
    for (const doc of [a, b]) {
      expect(part(doc, 'R4')).toMatchObject({ value: 150_000, tolerance: { percent: 5 } });
    }
  });

  test('concurrent tolerances of different U1 fields → both kept (nested map merges)', () => {
    const [a, b] = twoReplicas();
    setTolerance(a, ana, 'U1', 'softStart', { percent: 30 });
    setTolerance(b, ben, 'U1', 'uvlo', { percent: 3 });
    exchange(a, b);
    expect(part(a, 'U1')).toEqual(part(b, 'U1'));
    expect(part(a, 'U1')).toMatchObject({
      tolerances: { softStart: { percent: 30 }, uvlo: { percent: 3 }, vout: { percent: 2 } },
    });
  });

  test('concurrent addPart on two replicas → both parts, same order everywhere', () => {
    const [a, b] = twoReplicas();
    addPart(a, ana, { id: 'RA', kind: 'resistor', a: 'v33', b: '0', value: 1000 });
    addPart(b, ben, { id: 'RB', kind: 'resistor', a: 'v33', b: '0', value: 2000 });
    exchange(a, b);
    const order = readParts(a).map((p) => p.id);
    expect(order.slice(-2)).toEqual(['RA', 'RB']);
    expect(readParts(b).map((p) => p.id)).toEqual(order);
  });
});

describe('untyped callers', () => {
  test('addPart(null) / addPart(no id) → PlanEditError, never a TypeError', () => {
    const doc = planToDoc(smallPlan());
    expect(() => addPart(doc, ana, null as unknown as PartSpec)).toThrow(
      'part ?: must be an object with an id',
    );
    expect(() => addPart(doc, ana, { kind: 'resistor' } as unknown as PartSpec)).toThrow(
      PlanEditError,
    );
  });
});
