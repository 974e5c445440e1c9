/**
 * Regulator model: soft-start and slew-rate ramps, power-good threshold and delay, dropout,
 * current limit, discharge and UVLO. Expected values follow from the model definition and
 * first-order circuit theory (a ramp through a first-order lag is delayed by τ, closed form).
 */
import type { Element, RegulatorElement, SimResult } from '@rampart/collab/engine/netlist';
import { simulate } from '@rampart/collab/engine/sim/simulate';
import { expectClose, valueAt } from '../../../utils/asserts';

const EXACT = { rel: 1e-9 };

function regulator(over: Partial<RegulatorElement>): RegulatorElement {
  return {
    kind: 'regulator',
    id: 'U33',
    input: 'v5',
    en: 'en',
    out: 'v33',
    gnd: '0',
    pg: 'pg',
    vout: 3.3,
    enOn: 1.2,
    enOff: 1.0,
    uvlo: 2.5,
    softStart: 1e-3,
    dropout: 0.2,
    rout: 0.01,
    pgThreshold: 0.9,
    pgDelay: 2e-4,
    ...over,
  };
}

function board(reg: RegulatorElement, extra: Element[] = [], load = 100): Element[] {
  return [
    reg,
    { kind: 'capacitor', id: 'C33', a: 'v33', b: '0', farads: 10e-6 },
    { kind: 'resistor', id: 'RL', a: 'v33', b: '0', ohms: load },
    { kind: 'resistor', id: 'RPG', a: 'v5', b: 'pg', ohms: 10e3 },
    ...extra,
  ];
}

const input: Element = {
  kind: 'vsource',
  id: 'V5',
  pos: 'v5',
  neg: '0',
  wave: { kind: 'dc', value: 5 },
};
const enableAt = (t0: number): Element => ({
  kind: 'vsource',
  id: 'VEN',
  pos: 'en',
  neg: '0',
  wave: { kind: 'step', t0, v0: 0, v1: 3.3 },
});

function firstEvent(r: SimResult, what: string): number {
  const e = r.events.find((x) => x.what === what);
  if (!e) throw new Error(`no '${what}' event in ${JSON.stringify(r.events)}`);
  return e.t;
}

describe('regulator', () => {
  const t0 = 1e-4;
  const r = simulate({ elements: board(regulator({}), [input, enableAt(t0)]) }, { tStop: 3e-3 });
  const out = { time: r.steps!.time, values: r.steps!.nets.v33 };

  it('simulate(enable step) → enabled at the step and soft-start done softStart later, exact', () => {
    expectClose(firstEvent(r, 'regulator-enabled'), t0, EXACT, 'enable');
    expectClose(firstEvent(r, 'soft-start-done'), t0 + 1e-3, EXACT, 'soft-start end');
  });

  it('simulate(soft-start) → output follows the ramp divided by rout, lagging τ = C·(rout‖RL)', () => {
    const k = 100 / 100.01;
    const tau = 10e-6 * (1 / (1 / 0.01 + 1 / 100));
    const slope = 3.3 / 1e-3;
    for (const t of [3e-4, 6e-4, 9e-4]) {
      expectClose(valueAt(out, t), k * slope * (t - t0 - tau), { abs: 3.3 * 2e-4 }, `v33 at ${t}`);
    }
    expectClose(valueAt(out, 2e-3), 3.3 * k, { rel: 1e-6 }, 'regulated level');
  });

  it('simulate(soft-start) → pg released pgDelay after v33 crosses 0.9·vout', () => {
    // Steady ramp following: v33 = k·slope·(t − t0 − τ) reaches 2.97 V at the time below.
    const k = 100 / 100.01;
    const tau = 10e-6 * (1 / (1 / 0.01 + 1 / 100));
    const tCross = t0 + tau + 2.97 / k / (3.3 / 1e-3);
    expectClose(firstEvent(r, 'pg-released'), tCross + 2e-4, { rel: 1e-6 }, 'pg release');
    const pg = { time: r.steps!.time, values: r.steps!.nets.pg };
    expect(valueAt(pg, tCross + 1.9e-4)).toBeLessThan(0.1);
    expect(valueAt(pg, tCross + 2.1e-4)).toBeGreaterThan(4.9);
  });

  it('simulate(slewRate 1000 V/s) → ramp lasts vout/slewRate', () => {
    const s = simulate(
      { elements: board(regulator({ slewRate: 1000 }), [input, enableAt(t0)]) },
      { tStop: 5e-3 },
    );
    expectClose(firstEvent(s, 'soft-start-done'), t0 + 3.3e-3, EXACT, 'slew ramp end');
  });

  it('simulate(input ramp, en tied to input) → output tracks v(in) − dropout until regulation', () => {
    const ramp: Element = {
      kind: 'vsource',
      id: 'V5',
      pos: 'v5',
      neg: '0',
      wave: { kind: 'ramp', t0: 0, rise: 5e-3, v0: 0, v1: 5 },
    };
    const reg = regulator({ en: 'v5', softStart: 0, uvlo: 1.5 });
    const s = simulate({ elements: board(reg, [ramp], 1e3) }, { tStop: 6e-3 });
    const o = { time: s.steps!.time, values: s.steps!.nets.v33 };
    // UVLO releases at v5 = 1.5 V (1.5 ms); at 2.5 ms v5 = 2.5 V → 2.3 V out (dropout 0.2 V).
    expectClose(firstEvent(s, 'regulator-enabled'), 1.5e-3, EXACT, 'uvlo release');
    expectClose(valueAt(o, 2.5e-3), 2.3, { abs: 2e-3 }, 'dropout tracking');
    expectClose(valueAt(o, 5.5e-3), 3.3, { abs: 2e-3 }, 'regulation');
  });

  it('simulate(1 Ω load, ilimit 0.5 A) → output held at ilimit·RL', () => {
    const s = simulate(
      { elements: board(regulator({ ilimit: 0.5, softStart: 0 }), [input, enableAt(t0)], 1) },
      { tStop: 1e-3 },
    );
    expectClose(s.nets.v33[s.nets.v33.length - 1], 0.5, { rel: 1e-6 }, 'limited output');
  });

  it('simulate(enable off) → pg asserted at once, output discharged through rdischarge', () => {
    const en: Element = {
      kind: 'vsource',
      id: 'VEN',
      pos: 'en',
      neg: '0',
      wave: {
        kind: 'pwl',
        points: [
          [0, 3.3],
          [2e-3, 3.3],
          [2.000001e-3, 0],
        ],
      },
    };
    const s = simulate(
      { elements: board(regulator({ rdischarge: 10, softStart: 1e-4 }), [input, en], 1e3) },
      { tStop: 3e-3 },
    );
    const off = s.events.find((e) => e.what === 'regulator-disabled');
    expect(off).toBeDefined();
    const tOff = off!.t;
    // en falls through enOff 1.0 V at 2 ms + (2.3/3.3)·1 ns (closed form of the pwl edge).
    expectClose(tOff, 2e-3 + (2.3 / 3.3) * 1e-9, { rel: 1e-9 }, 'disable time');
    expect(s.events.some((e) => e.what === 'pg-asserted' && e.t === tOff)).toBe(true);
    // Discharge τ = C·(10 Ω ‖ 1 kΩ) from the regulated level (closed form).
    const tau = 10e-6 * (1 / (1 / 10 + 1 / 1e3));
    const o = { time: s.steps!.time, values: s.steps!.nets.v33 };
    const v0 = valueAt(o, tOff);
    expectClose(valueAt(o, tOff + tau), v0 * Math.exp(-1), { rel: 2e-3 }, 'discharge at τ');
  });
});
