/**
 * The linear-network path (one solve per step, matrix and LU factors kept while the integration
 * coefficient is unchanged) against the general assembly of every step: the results must be
 * the same to the last bit, since only the work is skipped, not any arithmetic.
 */
import type { Element, SimOptions, SimResult } from '@rampart/collab/engine/netlist';
import { compile } from '@rampart/collab/engine/sim/simulate';

/**
 * Every linear part kind: an ideal pwl source, a step source with series resistance, an
 * inductor with initial current, capacitors with initial voltages and an exponential current
 * source (invented demo values).
 */
const network: Element[] = [
  {
    kind: 'vsource',
    id: 'V24',
    pos: 'vin',
    neg: '0',
    wave: {
      kind: 'pwl',
      points: [
        [0, 0],
        [1e-3, 24],
      ],
    },
  },
  { kind: 'resistor', id: 'R1', a: 'vin', b: 'a', ohms: 1e3 },
  { kind: 'capacitor', id: 'C1', a: 'a', b: '0', farads: 1e-6 },
  { kind: 'inductor', id: 'L1', a: 'a', b: 'b', henries: 10e-3, i0: 1e-4 },
  { kind: 'resistor', id: 'R2', a: 'b', b: '0', ohms: 2.2e3 },
  { kind: 'capacitor', id: 'C2', a: 'b', b: '0', farads: 100e-9 },
  {
    kind: 'vsource',
    id: 'V33',
    pos: 'c',
    neg: '0',
    rs: 50,
    wave: { kind: 'step', t0: 2e-3, v0: 0, v1: 3.3 },
  },
  { kind: 'capacitor', id: 'C3', a: 'c', b: '0', farads: 47e-9, v0: 1 },
  {
    kind: 'isource',
    id: 'I1',
    from: '0',
    to: 'c',
    wave: { kind: 'exp', t0: 1e-3, v0: 0, v1: 1e-3, tau: 5e-4 },
  },
];

const options: SimOptions = { tStop: 5e-3, outputPoints: 500 };

function expectBitIdentical(fast: SimResult, general: SimResult): void {
  expect(Array.from(fast.steps!.time)).toEqual(Array.from(general.steps!.time));
  for (const net of Object.keys(general.nets)) {
    expect(Array.from(fast.steps!.nets[net])).toEqual(Array.from(general.steps!.nets[net]));
    expect(Array.from(fast.nets[net])).toEqual(Array.from(general.nets[net]));
  }
  expect(fast.stats).toEqual(general.stats);
}

describe('linear-network path', () => {
  it('run(every linear part kind) → bit-identical steps, output and stats to the general path', () => {
    const fast = compile({ elements: network }).run(options);
    const general = compile({ elements: network }, { linearFastPath: false }).run(options);
    expect(fast.stats.acceptedSteps).toBeGreaterThan(50);
    expectBitIdentical(fast, general);
  });

  it('run(values changed on a reused compiled circuit) → bit-identical to the general path', () => {
    const fast = compile({ elements: network });
    const general = compile({ elements: network }, { linearFastPath: false });
    fast.run(options);
    general.run(options);
    const changed = network.map((el) =>
      el.kind === 'capacitor' ? { ...el, farads: el.farads * 1.1 } : el,
    );
    expectBitIdentical(
      fast.run(options, { elements: changed }),
      general.run(options, { elements: changed }),
    );
  });

  it('run(RC at a constant step) → one solve per step and few factorisations', () => {
    const r = compile({ elements: network.slice(0, 3) }).run({ tStop: 0.1 });
    // Each attempt solves once; the instantaneous re-solve at t = 0 adds one more.
    expect(r.stats.newtonIterations).toBe(r.stats.acceptedSteps + r.stats.rejectedSteps + 1);
    expect(r.stats.luFactorisations).toBeLessThan(r.stats.acceptedSteps / 4);
  });
});
