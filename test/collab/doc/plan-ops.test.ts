import { docToPlan, readNets, readScenarios, readSettings } from '@rampart/collab/doc/doc-to-plan';
import { localOrigin } from '@rampart/collab/doc/doc-origin';
import {
  addNet,
  addScenario,
  removeNet,
  removeScenario,
  renamePlan,
  setSetting,
} from '@rampart/collab/doc/plan-ops';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';
import {
  addRequirement,
  removeRequirement,
  setRequirementField,
} from '@rampart/collab/doc/requirement-ops';
import { parsePlan } from '@rampart/collab/engine/plan/validate-plan';

import { smallPlan } from './fixtures';

const ana = localOrigin('u-ana', 'Ana');

describe('plan, net, scenario, setting and requirement ops', () => {
  test('renamePlan("  Board B ") → trimmed name; empty name refused', () => {
    const doc = planToDoc(smallPlan());
    renamePlan(doc, ana, '  Board B ');
    expect(docToPlan(doc).name).toBe('Board B');
    expect(() => renamePlan(doc, ana, ' ')).toThrow('plan name: must not be empty');
  });

  test('removeNet(v5) while parts use it → refused naming each part and signal', () => {
    const doc = planToDoc(smallPlan());
    expect(() => removeNet(doc, ana, 'v5')).toThrow(
      'net v5: still used by part U1, part RL5, part R4, part U2, signal v5',
    );
  });

  test('addNet then removeNet → added at the end, then removed; ground refused', () => {
    const doc = planToDoc(smallPlan());
    addNet(doc, ana, { id: 'spare', label: 'spare pad' });
    expect(readNets(doc).at(-1)).toEqual({ id: 'spare', label: 'spare pad' });
    removeNet(doc, ana, 'spare');
    expect(readNets(doc).map((n) => n.id)).not.toContain('spare');
    expect(() => addNet(doc, ana, { id: '0' })).toThrow('net 0: ground is always present');
  });

  test('addScenario(fast ramp) and removeScenario(dip) → scenarios follow', () => {
    const doc = planToDoc(smallPlan());
    addScenario(doc, ana, { id: 'fast', kind: 'fast-ramp' });
    removeScenario(doc, ana, 'dip');
    expect(readScenarios(doc).map((s) => s.id)).toEqual(['up', 'fast']);
    expect(() => addScenario(doc, ana, { id: 'bad', kind: 'brown-out', dipLevel: 20 })).toThrow(
      /^scenario bad dipLevel/,
    );
  });

  test('setSetting(duration, 50 ms) → stored; negative refused; undefined clears', () => {
    const doc = planToDoc(smallPlan());
    setSetting(doc, ana, 'duration', 0.05);
    expect(readSettings(doc).duration).toBe(0.05);
    expect(() => setSetting(doc, ana, 'duration', -1)).toThrow(/^settings duration duration/);
    expect(() => setSetting(doc, ana, 'colour', 1)).toThrow(/^settings colour/);
    setSetting(doc, ana, 'duration', undefined);
    expect(readSettings(doc)).toEqual({ targetMargin: 0.25 });
  });

  test('addRequirement(delay en33 → v33) then edit and remove → plan stays valid for the engine', () => {
    const doc = planToDoc(smallPlan());
    addRequirement(doc, ana, {
      id: 'ldo-delay',
      kind: 'delay',
      from: { signal: 'en33', level: 'on' },
      to: { signal: 'v33', level: 'start' },
      max: 0.01,
    });
    setRequirementField(doc, ana, 'ldo-delay', 'min', 0.0001);
    expect(parsePlan(docToPlan(doc)).requirements.at(-1)).toMatchObject({
      id: 'ldo-delay',
      min: 0.0001,
    });
    removeRequirement(doc, ana, 'ldo-delay');
    expect(docToPlan(doc).requirements.map((r) => r.id)).toEqual(['5v-before-3v3', 'v33-settles']);
  });

  test('addRequirement naming an unknown signal → refused naming requirement and signal', () => {
    const doc = planToDoc(smallPlan());
    expect(() =>
      addRequirement(doc, ana, { id: 'r', kind: 'settle', signal: 'v12', band: 0.1, by: 0.01 }),
    ).toThrow('requirement r: unknown signal v12');
    expect(() => setRequirementField(doc, ana, 'v33-settles', 'band', -1)).toThrow(
      /^requirement v33-settles band/,
    );
  });
});
