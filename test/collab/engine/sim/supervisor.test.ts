/**
 * Reset supervisor: release after every monitor has been in tolerance for the timeout, timer
 * restart on a dip, assertion delay after release. Monitored rails are linear sources, so the
 * threshold crossings are known in closed form and events must be exact to 1e-9 relative.
 */
import type { Element, SimResult, SupervisorElement } from '@rampart/collab/engine/netlist';
import { simulate } from '@rampart/collab/engine/sim/simulate';
import { expectClose, valueAt } from '../../../utils/asserts';

const EXACT = { rel: 1e-9 };

const supervisor: SupervisorElement = {
  kind: 'supervisor',
  id: 'USUP',
  supply: 'v33',
  gnd: '0',
  out: 'rst',
  monitors: [
    { net: 'v33', threshold: 3.0, hysteresis: 0.05 },
    { net: 'v12', threshold: 1.1, hysteresis: 0.02 },
  ],
  timeout: 1e-3,
  delay: 2e-5,
  rout: 50,
  vmin: 1.0,
  powerOn: { kind: 'low' },
};

/** The monitored 1.2 V rail as a piecewise-linear source of (time, volts) points. */
function v12Pwl(points: Array<[number, number]>): Element {
  return { kind: 'vsource', id: 'V12', pos: 'v12', neg: '0', wave: { kind: 'pwl', points } };
}

function run(v12: Element, tStop: number): SimResult {
  return simulate(
    {
      elements: [
        supervisor,
        {
          kind: 'vsource',
          id: 'V33',
          pos: 'v33',
          neg: '0',
          wave: { kind: 'ramp', t0: 0, rise: 1e-3, v0: 0, v1: 3.3 },
        },
        v12,
        { kind: 'resistor', id: 'RPU', a: 'v33', b: 'rst', ohms: 10e3 },
      ],
    },
    { tStop },
  );
}

function times(r: SimResult, what: string): number[] {
  return r.events.filter((e) => e.what === what).map((e) => e.t);
}

describe('supervisor', () => {
  // v33 passes 3.0 V at 3.0/3.3 ms; v12 ramps 0→1.2 V over 0.5–1 ms, passes 1.1 V at 0.5 + 1.1/1.2·0.5 ms.
  const t12 = 0.5e-3 + (1.1 / 1.2) * 0.5e-3;
  const v12Ramp: Element = {
    kind: 'vsource',
    id: 'V12',
    pos: 'v12',
    neg: '0',
    wave: { kind: 'ramp', t0: 0.5e-3, rise: 0.5e-3, v0: 0, v1: 1.2 },
  };

  it('simulate(rails ramping) → reset released timeout after the last rail is in tolerance', () => {
    const r = run(v12Ramp, 3e-3);
    expect(times(r, 'reset-released')).toHaveLength(1);
    expectClose(times(r, 'reset-released')[0], t12 + 1e-3, EXACT, 'release');
    const rst = { time: r.steps!.time, values: r.steps!.nets.rst };
    expect(valueAt(rst, t12 + 0.99e-3)).toBeLessThan(0.1);
    expectClose(
      valueAt(rst, t12 + 1.01e-3),
      3.3 * (1e9 / (1e9 + 1e4)),
      { rel: 1e-6 },
      'released level',
    );
  });

  it('simulate(dip before timeout) → timer restarts from the recovery', () => {
    // v12 dips to 1.0 V (below 1.1 − 0.02) at 1.4 ms and recovers through 1.1 V at 1.5 ms.
    const dip = v12Pwl([
      [0.5e-3, 0],
      [1e-3, 1.2],
      [1.35e-3, 1.2],
      [1.4e-3, 1.0],
      [1.6e-3, 1.2],
    ]);
    const r = run(dip, 4e-3);
    const recover = 1.4e-3 + (0.1 / 0.2) * 0.2e-3;
    expectClose(times(r, 'reset-released')[0], recover + 1e-3, EXACT, 'release after restart');
  });

  it('simulate(dip after release) → reset asserted delay after the fall below threshold − hysteresis', () => {
    // v12 falls 1.2 → 0.9 V over 2.5–2.6 ms: crosses 1.08 V at 2.5 + (0.12/0.3)·0.1 ms.
    const late = v12Pwl([
      [0.5e-3, 0],
      [1e-3, 1.2],
      [2.5e-3, 1.2],
      [2.6e-3, 0.9],
    ]);
    const r = run(late, 3e-3);
    const fall = 2.5e-3 + (0.12 / 0.3) * 0.1e-3;
    expectClose(times(r, 'reset-asserted')[1], fall + 2e-5, EXACT, 'assert');
  });
});
