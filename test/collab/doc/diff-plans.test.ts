import { diffPlans } from '@rampart/collab/doc/diff-plans';
import { docToPlan } from '@rampart/collab/doc/doc-to-plan';
import { localOrigin } from '@rampart/collab/doc/doc-origin';
import { addPart, removePart, setPartValue, setTolerance } from '@rampart/collab/doc/part-ops';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';
import { setSetting } from '@rampart/collab/doc/plan-ops';
import { setRequirementField } from '@rampart/collab/doc/requirement-ops';

import { smallPlan } from './fixtures';

const ana = localOrigin('u-ana');

describe('diffPlans', () => {
  test('identical plans → same, no changes', () => {
    const d = diffPlans(smallPlan(), smallPlan());
    expect(d.same).toBe(true);
    expect(d.parts).toEqual([]);
  });

  test('value, tolerance, added and removed parts → listed field by field', () => {
    const before = smallPlan();
    const doc = planToDoc(before);
    setPartValue(doc, ana, 'R4', 120_000);
    setTolerance(doc, ana, 'U1', 'softStart', { percent: 10 });
    removePart(doc, ana, 'RL33');
    addPart(doc, ana, { id: 'RL33B', kind: 'resistor', a: 'v33', b: '0', value: 68 });
    const d = diffPlans(before, docToPlan(doc));
    expect(d.same).toBe(false);
    expect(d.parts).toEqual([
      {
        id: 'U1',
        change: 'changed',
        fields: [{ path: 'tolerances.softStart.percent', before: 20, after: 10 }],
      },
      { id: 'R4', change: 'changed', fields: [{ path: 'value', before: 100_000, after: 120_000 }] },
      { id: 'RL33', change: 'removed', fields: [] },
      { id: 'RL33B', change: 'added', fields: [] },
    ]);
  });

  test('requirement limit and a setting changed → requirement and settings changes', () => {
    const before = smallPlan();
    const doc = planToDoc(before);
    setRequirementField(doc, ana, '5v-before-3v3', 'minGap', 0.001);
    setSetting(doc, ana, 'targetMargin', undefined);
    const d = diffPlans(before, docToPlan(doc));
    expect(d.requirements).toEqual([
      {
        id: '5v-before-3v3',
        change: 'changed',
        fields: [{ path: 'minGap', before: 0.0005, after: 0.001 }],
      },
    ]);
    expect(d.settings).toEqual([{ path: 'targetMargin', before: 0.25 }]);
  });

  test('margins given for both snapshots → changed ones listed with delta, unchanged omitted', () => {
    const d = diffPlans(smallPlan(), smallPlan(), {
      marginsBefore: { '5v-before-3v3': 0.002, 'v33-settles': 0.01 },
      marginsAfter: { '5v-before-3v3': 0.0015, 'v33-settles': 0.01, extra: null },
    });
    expect(d.same).toBe(false);
    expect(d.margins).toHaveLength(1);
    expect(d.margins[0].requirementId).toBe('5v-before-3v3');
    expect(d.margins[0].delta).toBeCloseTo(-0.0005, 12);
  });
});
