import { createEngineSimulator } from '@rampart/collab/engine/analysis/engine-simulator';
import { planMonteCarloChunk } from '@rampart/collab/engine/analysis/plan-monte-carlo';
import { measureCase, preparePlan, valuesAt } from '@rampart/collab/engine/analysis/plan-runner';
import { drawRun } from '@rampart/collab/engine/analysis/seeded-draws';
import { buildNetlist } from '@rampart/collab/engine/plan/to-netlist';
import { parsePlan } from '@rampart/collab/engine/plan/validate-plan';
import { ngspiceVoltages } from '../../utils/ngspice';

// A 3-stage RC ladder from the input ramp with a Shockley clamp diode on the last stage,
// every part toleranced (normal and uniform), at 85 °C.
const plan = parsePlan({
  schemaVersion: 1,
  name: 'rc ladder with clamp',
  nets: [{ id: 'vin' }, { id: 'n1' }, { id: 'n2' }, { id: 'n3' }, { id: 'clamp' }],
  parts: [
    {
      id: 'VIN',
      kind: 'vsource',
      role: 'input',
      pos: 'vin',
      neg: '0',
      value: 5,
      tolerance: { percent: 5 },
    },
    {
      id: 'R1',
      kind: 'resistor',
      a: 'vin',
      b: 'n1',
      value: 4700,
      tolerance: { percent: 5, distribution: { kind: 'normal' } },
    },
    { id: 'C1', kind: 'capacitor', a: 'n1', b: '0', value: 1e-7, tolerance: { percent: 10 } },
    {
      id: 'R2',
      kind: 'resistor',
      a: 'n1',
      b: 'n2',
      value: 10000,
      tolerance: { percent: 1 },
      temperature: { kind: 'tempco', ppmPerC: 200 },
    },
    {
      id: 'C2',
      kind: 'capacitor',
      a: 'n2',
      b: '0',
      value: 4.7e-8,
      tolerance: { percent: 10 },
      temperature: { kind: 'dielectric', class: 'X7R' },
    },
    { id: 'R3', kind: 'resistor', a: 'n2', b: 'n3', value: 22000, tolerance: { percent: 1 } },
    {
      id: 'C3',
      kind: 'capacitor',
      a: 'n3',
      b: '0',
      value: 2.2e-8,
      tolerance: { percent: 5 },
      temperature: { kind: 'dielectric', class: 'C0G' },
    },
    { id: 'VCL', kind: 'vsource', pos: 'clamp', neg: '0', value: 3.3 },
    {
      id: 'D1',
      kind: 'diode',
      anode: 'n3',
      cathode: 'clamp',
      model: { kind: 'shockley', is: 1e-14, n: 1.05 },
    },
  ],
  signals: [
    { id: 'vin', kind: 'rail', net: 'vin', nominal: 5, thresholds: { half: 2.5 } },
    { id: 'n3', kind: 'enable', net: 'n3', nominal: 3.9, thresholds: { half: 2.5 } },
    { id: 'clamp', kind: 'rail', net: 'clamp', nominal: 3.3 },
  ],
  requirements: [
    {
      id: 'delay',
      kind: 'delay',
      from: { signal: 'vin', level: 'half' },
      to: { signal: 'n3', level: 'half' },
      max: 5e-3,
    },
    { id: 'clamp', kind: 'back-drive', pin: 'n3', supply: 'clamp', drop: 0.7 },
  ],
  scenarios: [{ id: 'up', kind: 'power-up', temperatures: [85] }],
  settings: { duration: 8e-3, outputPoints: 2001 },
});

describe('Monte Carlo samples re-run in ngspice', () => {
  const prep = preparePlan(plan);
  const c = prep.cases[0];
  const seed = 2024;
  const runs = 4;
  const chunk = planMonteCarloChunk(prep, createEngineSimulator(), { runs, seed });

  it.each([0, 1, 2, 3])(
    'run %d → delay and clamp margin agree with ngspice within 0.1 %',
    async (run) => {
      const { x, y } = drawRun(prep.parameters, seed, run);
      const values = valuesAt(prep, c, x, y);
      const netlist = buildNetlist(plan, c, values);
      const step = c.tStop / 4000;
      const traces = await ngspiceVoltages(netlist, c.tStop, step, ['vin', 'n3', 'clamp']);
      // The same requirement code measures the ngspice traces, as it would a bench capture.
      const signals = new Map(
        plan.signals.map((spec) => [spec.id, { spec, wave: traces[spec.net] }]),
      );
      const [delay, clamp] = measureCase(prep, c, {
        sim: {
          time: new Float64Array(0),
          nets: {},
          events: [],
          stats: { acceptedSteps: 0, rejectedSteps: 0, newtonIterations: 0, luFactorisations: 0 },
          peaks: {},
        },
        signals,
      });
      const ours = chunk.samples.subarray(run * chunk.slots, (run + 1) * chunk.slots);
      // Slots: [delay margin, delay relative, clamp margin, clamp relative].
      const ourDelay = 5e-3 - ours[0];
      expect(Math.abs(ourDelay / (delay.measured ?? 0) - 1)).toBeLessThan(1e-3);
      // Clamp: 0.1 % of the 5 V full scale on the largest v(n3) − v(clamp).
      expect(Math.abs(ours[2] - (clamp.margin ?? 0))).toBeLessThan(5e-3);
    },
    60_000,
  );

  it('drawn values → differ between runs (the samples are not all nominal)', () => {
    const a = valuesAt(
      prep,
      c,
      drawRun(prep.parameters, seed, 0).x,
      drawRun(prep.parameters, seed, 0).y,
    );
    const b = valuesAt(
      prep,
      c,
      drawRun(prep.parameters, seed, 1).x,
      drawRun(prep.parameters, seed, 1).y,
    );
    expect(a.get('R1')).not.toBe(b.get('R1'));
    expect(a.get('C2')).not.toBe(b.get('C2'));
  });
});
