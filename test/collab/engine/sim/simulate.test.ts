/**
 * The entry points: compile/run reuse, output layout, LU reuse, the settle loop, and the demo
 * motor-drive board sequence.
 */
import type { Element } from '@rampart/collab/engine/netlist';
import { compile, ConvergenceError, simulate } from '@rampart/collab/engine/sim/simulate';
import { expectArrayClose, expectClose } from '../../../utils/asserts';
import { MOTOR_DRIVE_BOARD, MOTOR_DRIVE_T_STOP } from './fixtures/motor-drive-board';

const rc: Element[] = [
  {
    kind: 'vsource',
    id: 'V5',
    pos: 'v5',
    neg: '0',
    wave: { kind: 'step', t0: 1e-4, v0: 0, v1: 5 },
  },
  { kind: 'resistor', id: 'R1', a: 'v5', b: 'f', ohms: 1e3 },
  { kind: 'capacitor', id: 'C1', a: 'f', b: '0', farads: 1e-6 },
];

describe('simulate', () => {
  it('simulate(RC, 2000 points) → evenly spaced time axis, every net incl. ground, no NaN', () => {
    const r = simulate({ elements: rc }, { tStop: 5e-3, outputPoints: 2000 });
    expect(r.time.length).toBe(2000);
    expectClose(r.time[1] - r.time[0], 5e-3 / 1999, { rel: 1e-12 });
    expect(Object.keys(r.nets).sort()).toEqual(['0', 'f', 'v5']);
    expect(r.nets['0'].every((v) => v === 0)).toBe(true);
    for (const v of Object.values(r.nets)) expect(v.every(Number.isFinite)).toBe(true);
    // Accepted steps, plus t = 0, plus the repeated time just after the source jump.
    expect(r.steps!.time.length).toBe(r.stats.acceptedSteps + 2);
  });

  it('simulate(linear RC at maxStep) → far fewer LU factorisations than steps', () => {
    const r = simulate({ elements: rc }, { tStop: 0.1 });
    expect(r.stats.luFactorisations).toBeLessThan(r.stats.acceptedSteps / 2);
  });

  it('compile(board).run(values) → same waveforms as simulate(values)', () => {
    const c = compile(MOTOR_DRIVE_BOARD);
    c.run({ tStop: MOTOR_DRIVE_T_STOP });
    const changed = {
      ...MOTOR_DRIVE_BOARD,
      elements: MOTOR_DRIVE_BOARD.elements.map((el) =>
        el.id === 'CDLY' && el.kind === 'capacitor' ? { ...el, farads: 22e-9 } : el,
      ),
    };
    const reused = c.run({ tStop: MOTOR_DRIVE_T_STOP, probes: ['v33', 'rst'] }, changed);
    const fresh = simulate(changed, { tStop: MOTOR_DRIVE_T_STOP, probes: ['v33', 'rst'] });
    expectArrayClose(reused.nets.v33, fresh.nets.v33, { abs: 0 });
    expect(reused.events).toEqual(fresh.events);
  });

  it('simulate(motor-drive board) → rails come up in the planned order', () => {
    const r = simulate(MOTOR_DRIVE_BOARD, { tStop: MOTOR_DRIVE_T_STOP });
    const at = (element: string, what: string): number => {
      const e = r.events.find((x) => x.element === element && x.what === what);
      if (!e) throw new Error(`missing ${element} ${what}`);
      return e.t;
    };
    expect(at('U5', 'regulator-enabled')).toBeLessThan(at('U5', 'pg-released'));
    expect(at('U5', 'pg-released')).toBeLessThan(at('U33', 'regulator-enabled'));
    expect(at('U33', 'pg-released')).toBeLessThanOrEqual(at('U12', 'regulator-enabled'));
    expect(at('USUP', 'reset-released')).toBeGreaterThan(at('U12', 'soft-start-done') + 1e-3 * 0.5);
    // U5 enables when en5 = v24/6 passes 1.2 V, i.e. v24 = 7.2 V on the 2 ms ramp from 0.2 ms.
    expectClose(at('U5', 'regulator-enabled'), 2e-4 + (7.2 / 24) * 2e-3, { rel: 1e-6 });
  });

  it('simulate(inverting comparator on its own output, no delay) → ConvergenceError naming it', () => {
    const loop: Element[] = [
      { kind: 'vsource', id: 'V5', pos: 'v5', neg: '0', wave: { kind: 'dc', value: 5 } },
      { kind: 'vsource', id: 'VR', pos: 'ref', neg: '0', wave: { kind: 'dc', value: 2.5 } },
      { kind: 'resistor', id: 'RPU', a: 'v5', b: 'o', ohms: 10e3 },
      {
        kind: 'comparator',
        id: 'UOSC',
        inP: 'ref',
        inN: 'o',
        threshold: 0,
        hysteresis: 0,
        delay: 0,
        supply: 'v5',
        gnd: '0',
        out: 'o',
        output: 'open-drain',
        rout: 10,
        vmin: 0,
        powerOn: { kind: 'low' },
      },
    ];
    try {
      simulate({ elements: loop }, { tStop: 1e-3 });
      throw new Error('expected a ConvergenceError');
    } catch (e) {
      expect(e).toBeInstanceOf(ConvergenceError);
      expect((e as ConvergenceError).parts).toContain('UOSC');
    }
  });
});
