import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  defaultTemperatures,
  inputWaveform,
  scenarioCases,
} from '@rampart/collab/engine/plan/scenarios';
import { resolveSettings } from '@rampart/collab/engine/plan/plan-settings';
import { parsePlan } from '@rampart/collab/engine/plan/validate-plan';
import { buildNetlist } from '@rampart/collab/engine/plan/to-netlist';
import {
  describeDeviation,
  parameterValue,
  planParameters,
} from '@rampart/collab/engine/models/parameters';
import type { Plan } from '@rampart/collab/engine/plan/plan-schema';

const demo = (): Plan =>
  parsePlan(
    JSON.parse(
      readFileSync(join(__dirname, '../../../collab/engine/examples/motor-drive.json'), 'utf8'),
    ),
  );

describe('scenarioCases', () => {
  it('demo without scenarios → power-up and power-down at −55, 25 and 125 °C (X7R range)', () => {
    const plan = demo();
    const cases = scenarioCases(plan, resolveSettings(plan));
    expect(cases.map((c) => `${c.scenarioId}@${c.temperature}`)).toEqual([
      'power-up@-55',
      'power-up@25',
      'power-up@125',
      'power-down@-55',
      'power-down@25',
      'power-down@125',
    ]);
  });

  it('X5R added → extremes narrow to the common range −55…85 °C', () => {
    const plan = demo();
    const withX5R: Plan = {
      ...plan,
      parts: plan.parts.map((p) =>
        p.id === 'C1' ? { ...p, temperature: { kind: 'dielectric', class: 'X5R' } } : p,
      ),
    } as Plan;
    expect(defaultTemperatures(withX5R, resolveSettings(withX5R))).toEqual([-55, 25, 85]);
  });

  it('brown-out with dipLevel 0.6, slow and fast ramps → input shapes and windows from the settings', () => {
    const plan: Plan = {
      ...demo(),
      scenarios: [
        { id: 'dip', kind: 'brown-out', dipLevel: 0.6, dipWidth: 2e-3, temperatures: [25] },
        { id: 'slow', kind: 'slow-ramp', temperatures: [25] },
        { id: 'fast', kind: 'fast-ramp', temperatures: [25] },
        { id: 'down', kind: 'power-down', temperatures: [25] },
      ],
    };
    const [dip, slow, fast, down] = scenarioCases(plan, resolveSettings(plan));
    // duration 30 ms, rise and fall 1 ms by default.
    expect(dip.inputShape).toEqual([
      [0, 0],
      [1e-3, 1],
      [31e-3, 1],
      [32e-3, 0.6],
      [34e-3, 0.6],
      [35e-3, 1],
    ]);
    expect(dip.windowStart).toBeCloseTo(31e-3, 15);
    expect(slow.inputShape[1][0]).toBeCloseTo(10e-3, 15);
    expect(fast.inputShape[1][0]).toBeCloseTo(0.1e-3, 15);
    expect(down.inputShape).toEqual([
      [0, 0],
      [1e-3, 1],
      [31e-3, 1],
      [32e-3, 0],
    ]);
    expect(down.tStop).toBeCloseTo(61e-3, 15);
    expect(inputWaveform(dip, 24)).toEqual({
      kind: 'pwl',
      points: dip.inputShape.map(([t, f]) => [t, f * 24]),
    });
  });
});

describe('planParameters and parameterValue', () => {
  const plan = demo();
  const params = planParameters(plan, 3);

  it('demo → the seventeen toleranced parameters in plan order', () => {
    expect(params.map((p) => p.id)).toEqual([
      'VIN',
      'R1',
      'R2',
      'U1.softStart',
      'C1',
      'R4',
      'C3',
      'U2.enOn',
      'C4',
      'C5',
      'U4.timeout',
      'R7',
      'C6',
      'R8',
      'R9',
      'R10',
      'R11',
    ]);
  });

  it('C3 (100 nF ±10 % X7R) at +1, +1, 125 °C → 100 nF · 1.1 · 1.15; at −1, −1 → · 0.9 · 0.85', () => {
    const c3 = params.find((p) => p.id === 'C3');
    if (c3 === undefined) throw new Error('C3 missing');
    expect(parameterValue(c3, 1, 1, 125)).toBeCloseTo(1e-7 * 1.1 * 1.15, 20);
    expect(parameterValue(c3, -1, -1, 125)).toBeCloseTo(1e-7 * 0.9 * 0.85, 20);
    expect(parameterValue(c3, 0, 0, 125)).toBe(1e-7);
    expect(describeDeviation(c3, 1e-7 * 1.1 * 1.15)).toBe('C3 +26.5 %');
  });

  it('R4 (100 k ±1 %, ±100 ppm/°C) at +1, +1, −55 °C → 100 k · 1.01 · 1.008', () => {
    const r4 = params.find((p) => p.id === 'R4');
    if (r4 === undefined) throw new Error('R4 missing');
    expect(parameterValue(r4, 1, 1, -55)).toBeCloseTo(1e5 * 1.01 * 1.008, 8);
  });

  it('buildNetlist with U4.timeout = 8 ms → supervisor element carries 8 ms, other fields untouched', () => {
    const c = scenarioCases(plan, resolveSettings(plan))[0];
    const nl = buildNetlist(plan, c, new Map([['U4.timeout', 8e-3]]));
    const u4 = nl.elements.find((e) => e.id === 'U4');
    expect(u4).toMatchObject({ kind: 'supervisor', timeout: 8e-3, delay: 2e-5, out: 'rst_n' });
    expect(nl.temperature).toBe(-55);
  });
});
