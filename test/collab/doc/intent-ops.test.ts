import { readIntents } from '@rampart/collab/doc/drawn-intent';
import { localOrigin } from '@rampart/collab/doc/doc-origin';
import { describeEdit } from '@rampart/collab/doc/edit-record';
import {
  addRampPoint,
  moveRampPoint,
  removeRampPoint,
  setIntent,
} from '@rampart/collab/doc/intent-ops';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';
import { addSignal, removeSignal, setThreshold } from '@rampart/collab/doc/signal-ops';
import { readSignals } from '@rampart/collab/doc/doc-to-plan';

import { smallIntents, smallPlan } from './fixtures';

const ana = localOrigin('u-ana', 'Ana');

describe('intent and signal ops', () => {
  test('moveRampPoint(v5, end, 3.5 ms / 5.1 V) → end and level moved', () => {
    const doc = planToDoc(smallPlan(), { intents: smallIntents() });
    const record = moveRampPoint(doc, ana, 'v5', 'end', { t: 0.0035, v: 5.1 });
    expect(readIntents(doc).v5).toMatchObject({ start: 0.001, end: 0.0035, level: 5.1 });
    expect(record).toMatchObject({ before: { t: 0.003, v: 5 }, after: { t: 0.0035, v: 5.1 } });
  });

  test('moveRampPoint(v5, knee) → that breakpoint moved, others untouched', () => {
    const doc = planToDoc(smallPlan(), { intents: smallIntents() });
    moveRampPoint(doc, ana, 'v5', 'knee', { t: 0.002, v: 4 });
    expect(readIntents(doc).v5.points).toEqual([{ id: 'knee', t: 0.002, v: 4 }]);
  });

  test('moveRampPoint(v5, start) past the end → PlanEditError naming signal v5', () => {
    const doc = planToDoc(smallPlan(), { intents: smallIntents() });
    expect(() => moveRampPoint(doc, ana, 'v5', 'start', { t: 0.01, v: 0 })).toThrow(
      'intent of signal v5: end must not be before start',
    );
  });

  test('moveRampPoint on a signal without intent / unknown point → clear errors', () => {
    const doc = planToDoc(smallPlan(), { intents: smallIntents() });
    expect(() => moveRampPoint(doc, ana, 'en33', 'end', { t: 1, v: 1 })).toThrow(
      'intent en33: no intent drawn for this signal yet',
    );
    expect(() => moveRampPoint(doc, ana, 'v5', 'nope', { t: 1, v: 1 })).toThrow('no point nope');
    expect(() => moveRampPoint(doc, ana, 'ghost', 'end', { t: 1, v: 1 })).toThrow(
      'signal ghost: no such id',
    );
  });

  test('setIntent, addRampPoint, removeRampPoint → the intent follows', () => {
    const doc = planToDoc(smallPlan());
    setIntent(doc, ana, 'en33', { start: 0.002, end: 0.004, level: 5, points: [] });
    addRampPoint(doc, ana, 'en33', { id: 'p1', t: 0.003, v: 2 });
    expect(readIntents(doc).en33.points).toEqual([{ id: 'p1', t: 0.003, v: 2 }]);
    expect(() => addRampPoint(doc, ana, 'en33', { id: 'end', t: 0, v: 0 })).toThrow('reserved');
    removeRampPoint(doc, ana, 'en33', 'p1');
    expect(readIntents(doc).en33.points).toEqual([]);
  });

  test('setThreshold(v33, in-regulation, 3.135) → threshold added; NaN refused by name', () => {
    const doc = planToDoc(smallPlan());
    const record = setThreshold(doc, ana, 'v33', 'in-regulation', 3.135);
    expect(readSignals(doc).find((s) => s.id === 'v33')?.thresholds).toEqual({
      start: 0.3,
      'in-regulation': 3.135,
    });
    expect(describeEdit(record)).toBe('Ana set signal v33 thresholds.in-regulation to 3.135');
    expect(() => setThreshold(doc, ana, 'v33', 'x', Number.NaN)).toThrow(/^signal v33 thresholds/);
  });

  test('removeSignal(v33) while a requirement uses it → refused naming the requirement', () => {
    const doc = planToDoc(smallPlan(), { intents: smallIntents() });
    expect(() => removeSignal(doc, ana, 'v33')).toThrow(
      'signal v33: still used by requirement 5v-before-3v3, v33-settles',
    );
  });

  test('addSignal then removeSignal → gone with its intent', () => {
    const doc = planToDoc(smallPlan());
    addSignal(doc, ana, { id: 'vin', kind: 'rail', net: 'vin', nominal: 24 });
    setIntent(doc, ana, 'vin', { start: 0, end: 0.001, level: 24, points: [] });
    removeSignal(doc, ana, 'vin');
    expect(readSignals(doc).map((s) => s.id)).not.toContain('vin');
    expect(readIntents(doc)).not.toHaveProperty('vin');
  });

  test('addSignal on an unknown net → PlanEditError naming signal and net', () => {
    const doc = planToDoc(smallPlan());
    expect(() =>
      addSignal(doc, ana, { id: 'x', kind: 'rail', net: 'nowhere', nominal: 1 }),
    ).toThrow('signal x net: unknown net nowhere');
  });
});
