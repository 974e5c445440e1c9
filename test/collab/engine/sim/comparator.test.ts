/**
 * Comparator model: switching at the analytically known crossing plus the propagation delay,
 * hysteresis, the inertial delay, and the power-on glitch. Inputs are driven by linear sources,
 * so crossing times are known in closed form and events must be exact to 1e-9 relative.
 */
import type { ComparatorElement, Element, SimResult } from '@rampart/collab/engine/netlist';
import { simulate } from '@rampart/collab/engine/sim/simulate';
import { expectClose, valueAt } from '../../../utils/asserts';

const EXACT = { rel: 1e-9 };

function comparator(over: Partial<ComparatorElement>): ComparatorElement {
  return {
    kind: 'comparator',
    id: 'UCMP',
    inP: 's',
    inN: '0',
    threshold: 2,
    hysteresis: 0.2,
    delay: 1e-5,
    supply: 'v5',
    gnd: '0',
    out: 'o',
    output: 'push-pull',
    rout: 10,
    vmin: 0,
    powerOn: { kind: 'low' },
    ...over,
  };
}

function run(cmp: ComparatorElement, extra: Element[], tStop: number): SimResult {
  return simulate({ elements: [cmp, ...extra] }, { tStop });
}

function eventTimes(r: SimResult, what: string): number[] {
  return r.events.filter((e) => e.what === what).map((e) => e.t);
}

const triangle: Element = {
  kind: 'vsource',
  id: 'VS',
  pos: 's',
  neg: '0',
  wave: {
    kind: 'pwl',
    points: [
      [0, 0],
      [1e-3, 5],
      [2e-3, 0],
    ],
  },
};
const supply: Element = {
  kind: 'vsource',
  id: 'V5',
  pos: 'v5',
  neg: '0',
  wave: { kind: 'dc', value: 5 },
};
const load: Element = { kind: 'resistor', id: 'RL', a: 'o', b: '0', ohms: 1e3 };
/** The comparator's own supply ramping 0 → 5 V over 1 ms (power-on tests). */
const ramp: Element = {
  kind: 'vsource',
  id: 'V5',
  pos: 'v5',
  neg: '0',
  wave: { kind: 'ramp', t0: 0, rise: 1e-3, v0: 0, v1: 5 },
};
/** The input held at 3 V, above the 2 V threshold. */
const high: Element = {
  kind: 'vsource',
  id: 'VS',
  pos: 's',
  neg: '0',
  wave: { kind: 'dc', value: 3 },
};

describe('comparator', () => {
  it('simulate(triangle into comparator) → high at crossing of thr + hyst/2 plus delay, exact', () => {
    const r = run(comparator({}), [triangle, supply, load], 2.5e-3);
    // s = 5000·t crosses 2.1 V at 0.42 ms; falling s = 5 − 5000·(t − 1 ms) crosses 1.9 V at 1.62 ms.
    expect(eventTimes(r, 'comparator-high')).toHaveLength(1);
    expectClose(eventTimes(r, 'comparator-high')[0], 4.2e-4 + 1e-5, EXACT, 'rise event');
    expectClose(eventTimes(r, 'comparator-low')[1], 1.62e-3 + 1e-5, EXACT, 'fall event');
    // Push-pull high through 10 Ω into 1 kΩ ∥ the 1 GΩ open-output leak (closed form).
    const rl = 1 / (1 / 1e3 + 1e-9);
    const o = { time: r.time, values: r.nets.o };
    expectClose(valueAt(o, 1e-3), (5 * rl) / (rl + 10), { rel: 1e-9 }, 'high level');
  });

  it('simulate(comparator) → output unchanged between crossing and end of delay', () => {
    const r = run(comparator({}), [triangle, supply, load], 2.5e-3);
    const o = { time: r.steps!.time, values: r.steps!.nets.o };
    expect(valueAt(o, 4.2e-4 + 0.99e-5)).toBeLessThan(1e-3);
    expect(valueAt(o, 4.2e-4 + 1.01e-5)).toBeGreaterThan(4.9);
  });

  it('simulate(pulse shorter than delay) → swallowed by the inertial delay', () => {
    const blip: Element = {
      kind: 'vsource',
      id: 'VS',
      pos: 's',
      neg: '0',
      wave: {
        kind: 'pwl',
        points: [
          [0, 0],
          [1e-4, 0],
          [1.01e-4, 3],
          [1.04e-4, 3],
          [1.05e-4, 0],
        ],
      },
    };
    const r = run(comparator({ delay: 2e-5 }), [blip, supply, load], 3e-4);
    expect(eventTimes(r, 'comparator-high')).toHaveLength(0);
    expect(Math.max(...Array.from(r.nets.o))).toBeLessThan(1e-3);
  });

  it('simulate(open-drain with pull-up) → low through rout, released to the pull-up', () => {
    const pullUp: Element = { kind: 'resistor', id: 'RPU', a: 'v5', b: 'o', ohms: 10e3 };
    const r = run(
      comparator({ output: 'open-drain', rout: 100, delay: 0 }),
      [triangle, supply, pullUp],
      2e-3,
    );
    const o = { time: r.time, values: r.nets.o };
    // Low: divider 10 kΩ / 100 Ω; released: pull-up only (1 GΩ leak) — closed form.
    expectClose(valueAt(o, 1e-4), (5 * 100) / 10100, { rel: 1e-6 }, 'low level');
    expectClose(valueAt(o, 1e-3), 5 * (1e9 / (1e9 + 1e4)), { rel: 1e-6 }, 'released level');
    expectClose(eventTimes(r, 'comparator-high')[0], 4.2e-4, EXACT, 'release time');
  });

  it('simulate(supply ramp with pulse-low power-on) → low glitch of the set width at vstart', () => {
    // Supply ramps 0→5 V over 1 ms: crosses vstart 1 V at 0.2 ms; glitch lasts 50 µs.
    const pullUp: Element = { kind: 'resistor', id: 'RPU', a: 'v5', b: 'o', ohms: 10e3 };
    const cmp = comparator({
      output: 'open-drain',
      rout: 100,
      delay: 0,
      vmin: 2.5,
      powerOn: { kind: 'pulse-low', vstart: 1, width: 5e-5 },
    });
    const r = run(cmp, [ramp, high, pullUp], 1.5e-3);
    expectClose(eventTimes(r, 'power-on-pulse-start')[0], 2e-4, EXACT, 'glitch start');
    expectClose(eventTimes(r, 'power-on-pulse-end')[0], 2.5e-4, EXACT, 'glitch end');
    const o = { time: r.steps!.time, values: r.steps!.nets.o };
    const v5 = (t: number): number => (5 * t) / 1e-3;
    expectClose(valueAt(o, 1.9e-4), v5(1.9e-4), { rel: 1e-4 }, 'before glitch: pulled up');
    expectClose(
      valueAt(o, 2.2e-4),
      (v5(2.2e-4) * 100) / 10100,
      { rel: 1e-4 },
      'during glitch: low',
    );
    expectClose(valueAt(o, 3e-4), v5(3e-4), { rel: 1e-4 }, 'after glitch: released');
  });

  it('simulate(supply below vmin, powerOn low) → output low until vmin then follows input', () => {
    const r = run(comparator({ vmin: 2.5, delay: 0 }), [ramp, high, load], 1.5e-3);
    // Supply reaches vmin 2.5 V at 0.5 ms (closed form of the ramp).
    expectClose(eventTimes(r, 'comparator-high')[0], 5e-4, EXACT, 'vmin release');
    expect(valueAt({ time: r.steps!.time, values: r.steps!.nets.o }, 4.9e-4)).toBeLessThan(1e-3);
  });
});
