import * as Y from 'yjs';

import { readEntry } from '@rampart/collab/doc/doc-to-plan';
import { localOrigin, REMOTE_ORIGIN } from '@rampart/collab/doc/doc-origin';
import { setPartValue, setTolerance } from '@rampart/collab/doc/part-ops';
import { createPlanUndo } from '@rampart/collab/doc/plan-undo';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';
import type { PartSpec } from '@rampart/collab/engine/plan/plan-schema-parts';

import { smallPlan } from './fixtures';

const value = (doc: Y.Doc, id: string) =>
  (readEntry<PartSpec>(doc, 'parts', id) as { value?: number }).value;

function replicas(): [Y.Doc, Y.Doc] {
  const seed = Y.encodeStateAsUpdate(planToDoc(smallPlan()));
  const a = new Y.Doc();
  const b = new Y.Doc();
  Y.applyUpdate(a, seed, REMOTE_ORIGIN);
  Y.applyUpdate(b, seed, REMOTE_ORIGIN);
  // Live link: every change on one side reaches the other as a remote update.
  a.on('update', (u: Uint8Array, origin: unknown) => {
    if (origin !== REMOTE_ORIGIN) Y.applyUpdate(b, u, REMOTE_ORIGIN);
  });
  b.on('update', (u: Uint8Array, origin: unknown) => {
    if (origin !== REMOTE_ORIGIN) Y.applyUpdate(a, u, REMOTE_ORIGIN);
  });
  return [a, b];
}

describe('createPlanUndo', () => {
  test('two named ops then undo twice → both reverted in reverse order, records returned', () => {
    const doc = planToDoc(smallPlan());
    const ana = localOrigin('u-ana', 'Ana');
    const undo = createPlanUndo(doc, ana);
    setPartValue(doc, ana, 'R4', 120_000);
    setPartValue(doc, ana, 'R4', 150_000);
    expect(undo.undo()).toMatchObject({ op: 'setPartValue', before: 120_000, after: 150_000 });
    expect(value(doc, 'R4')).toBe(120_000);
    expect(undo.undo()).toMatchObject({ before: 100_000, after: 120_000 });
    expect(value(doc, 'R4')).toBe(100_000);
    expect(undo.canUndo()).toBe(false);
    expect(undo.undo()).toBeUndefined();
    undo.destroy();
  });

  test('undo then redo → edit re-applied and its record kept across the stacks', () => {
    const doc = planToDoc(smallPlan());
    const ana = localOrigin('u-ana');
    const undo = createPlanUndo(doc, ana);
    setPartValue(doc, ana, 'RL5', 47);
    undo.undo();
    expect(undo.canRedo()).toBe(true);
    expect(undo.redo()).toMatchObject({ targetId: 'RL5', after: 47 });
    expect(value(doc, 'RL5')).toBe(47);
    expect(undo.undo()).toMatchObject({ targetId: 'RL5', after: 47 });
    undo.destroy();
  });

  test("Ana's undo with Ben's concurrent edit → only Ana's change reverted, on both replicas", () => {
    const [a, b] = replicas();
    const ana = localOrigin('u-ana', 'Ana');
    const ben = localOrigin('u-ben', 'Ben');
    const anaUndo = createPlanUndo(a, ana);
    const benUndo = createPlanUndo(b, ben);
    setPartValue(a, ana, 'R4', 120_000);
    setTolerance(b, ben, 'C3', 'value', { percent: 5 });
    setPartValue(b, ben, 'RL5', 47);
    anaUndo.undo();
    for (const doc of [a, b]) {
      expect(value(doc, 'R4')).toBe(100_000);
      expect(value(doc, 'RL5')).toBe(47);
      expect(readEntry<PartSpec>(doc, 'parts', 'C3')).toMatchObject({ tolerance: { percent: 5 } });
    }
    expect(benUndo.canUndo()).toBe(true);
    expect(anaUndo.canUndo()).toBe(false);
    anaUndo.destroy();
    benUndo.destroy();
  });

  test('remote and persistence writes → never on the undo stack', () => {
    const [a, b] = replicas();
    const ana = localOrigin('u-ana');
    const undo = createPlanUndo(a, ana);
    setPartValue(b, localOrigin('u-ben'), 'R4', 99_000);
    expect(value(a, 'R4')).toBe(99_000);
    expect(undo.canUndo()).toBe(false);
    undo.destroy();
  });

  test('onChange → called when the stacks change, not after unsubscribe', () => {
    const doc = planToDoc(smallPlan());
    const ana = localOrigin('u-ana');
    const undo = createPlanUndo(doc, ana);
    let calls = 0;
    const off = undo.onChange(() => calls++);
    setPartValue(doc, ana, 'R4', 110_000);
    undo.undo();
    expect(calls).toBe(3); // added to undo, added to redo, popped from undo
    off();
    setPartValue(doc, ana, 'R4', 130_000);
    expect(calls).toBe(3);
    undo.destroy();
  });
});
