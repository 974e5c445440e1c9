/**
 * Invalid setups get a named error naming the part, net or field — never a crash or a NaN.
 */
import type { Element, Netlist } from '@rampart/collab/engine/netlist';
import {
  compile,
  NetlistError,
  SingularMatrixError,
  simulate,
  validateNetlist,
} from '@rampart/collab/engine/sim/simulate';

const rc: Element[] = [
  { kind: 'vsource', id: 'V5', pos: 'v5', neg: '0', wave: { kind: 'dc', value: 5 } },
  { kind: 'resistor', id: 'R1', a: 'v5', b: 'f', ohms: 1e3 },
  { kind: 'capacitor', id: 'C1', a: 'f', b: '0', farads: 1e-6 },
];

/** Runs `fn` and returns the NetlistError it throws (fails the test otherwise). */
function netlistError(fn: () => unknown): NetlistError {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(NetlistError);
    return e as NetlistError;
  }
  throw new Error('expected a NetlistError');
}

function withElement(el: unknown): Netlist {
  return { elements: [...rc, el as Element] };
}

describe('validateNetlist', () => {
  it('validateNetlist(RC) → passes', () => {
    expect(validateNetlist({ elements: rc }).nodeNames).toEqual(['v5', 'f']);
  });

  it('validateNetlist(unknown kind) → NetlistError naming the element and kind', () => {
    const e = netlistError(() =>
      validateNetlist(withElement({ kind: 'fuse', id: 'F1', a: 'f', b: '0' })),
    );
    expect(e.element).toBe('F1');
    expect(e.message).toContain("unknown kind 'fuse'");
  });

  it('validateNetlist(duplicate id) → NetlistError naming the id', () => {
    const e = netlistError(() => validateNetlist(withElement({ ...rc[1], b: '0' })));
    expect(e.element).toBe('R1');
    expect(e.message).toContain("duplicate element id 'R1'");
  });

  it.each([
    ['negative', -1],
    ['zero', 0],
    ['NaN', Number.NaN],
    ['infinite', Number.POSITIVE_INFINITY],
  ])('validateNetlist(%s resistance) → NetlistError naming the part and field', (_label, ohms) => {
    const e = netlistError(() =>
      validateNetlist(withElement({ kind: 'resistor', id: 'RBAD', a: 'f', b: '0', ohms })),
    );
    expect(e.element).toBe('RBAD');
    expect(e.field).toBe('ohms');
    expect(e.message).toContain("resistor 'RBAD': ohms must be a finite number > 0");
  });

  it('validateNetlist(pwl times not increasing) → NetlistError naming the point', () => {
    const e = netlistError(() =>
      validateNetlist({
        elements: [
          {
            kind: 'vsource',
            id: 'VP',
            pos: 'p',
            neg: '0',
            wave: {
              kind: 'pwl',
              points: [
                [0, 0],
                [1e-3, 1],
                [1e-3, 2],
              ],
            },
          },
          { kind: 'resistor', id: 'R1', a: 'p', b: '0', ohms: 1e3 },
        ],
      }),
    );
    expect(e.field).toBe('wave.points[2][0]');
  });

  it('validateNetlist(enOff above enOn) → NetlistError naming the regulator', () => {
    const reg = {
      kind: 'regulator',
      id: 'U5',
      input: 'v5',
      en: 'v5',
      out: 'f',
      gnd: '0',
      vout: 3.3,
      enOn: 1,
      enOff: 2,
      uvlo: 2,
      softStart: 1e-3,
      dropout: 0.2,
      rout: 0.01,
    };
    const e = netlistError(() => validateNetlist(withElement(reg)));
    expect(e.element).toBe('U5');
    expect(e.field).toBe('enOff');
  });

  it('validateNetlist(net reached only through a current source) → NetlistError naming the net', () => {
    const e = netlistError(() =>
      validateNetlist(
        withElement({
          kind: 'isource',
          id: 'I1',
          from: 'f',
          to: 'island',
          wave: { kind: 'dc', value: 1e-3 },
        }),
      ),
    );
    expect(e.net).toBe('island');
    expect(e.message).toContain("net 'island' is floating");
    expect(e.message).toContain('I1');
  });

  it('validateNetlist(net only at a comparator input) → NetlistError naming the net', () => {
    const cmp = {
      kind: 'comparator',
      id: 'UC',
      inP: 'dangling',
      inN: '0',
      threshold: 1,
      hysteresis: 0,
      delay: 0,
      supply: 'v5',
      gnd: '0',
      out: 'f',
      output: 'open-drain',
      rout: 10,
      vmin: 0,
      powerOn: { kind: 'low' },
    };
    expect(netlistError(() => validateNetlist(withElement(cmp))).net).toBe('dangling');
  });

  it('validateNetlist(loop of ideal voltage sources) → NetlistError naming the sources', () => {
    const e = netlistError(() =>
      validateNetlist(
        withElement({
          kind: 'vsource',
          id: 'V5B',
          pos: 'v5',
          neg: '0',
          wave: { kind: 'dc', value: 5 },
        }),
      ),
    );
    expect(e.element).toBe('V5B');
    expect(e.message).toContain('V5');
  });

  it('validateNetlist(element on one net at both ends) → NetlistError naming part and net', () => {
    const e = netlistError(() =>
      validateNetlist(withElement({ kind: 'resistor', id: 'RS', a: 'f', b: 'f', ohms: 1 })),
    );
    expect(e.element).toBe('RS');
    expect(e.net).toBe('f');
  });

  it('validateNetlist(501 elements) → NetlistError stating the 500 limit', () => {
    const many = Array.from({ length: 499 }, (_, i): Element => ({
      kind: 'resistor',
      id: `R${i + 2}`,
      a: 'f',
      b: '0',
      ohms: 1e6,
    }));
    expect(netlistError(() => validateNetlist({ elements: [...rc, ...many] })).message).toContain(
      'the limit is 500',
    );
  });
});

describe('simulate options and runtime errors', () => {
  it.each([
    ['tStop', { tStop: 0 }],
    ['outputPoints', { tStop: 1e-3, outputPoints: 200_001 }],
    ['maxStep', { tStop: 1e-3, maxStep: -1 }],
    ['reltol', { tStop: 1e-3, reltol: 0.5 }],
  ])('simulate(bad %s) → NetlistError naming the option', (field, options) => {
    expect(netlistError(() => simulate({ elements: rc }, options)).field).toBe(field);
  });

  it('simulate(toleranceScale with an unknown net, or a negative value) → NetlistError naming it', () => {
    const unknown = netlistError(() =>
      simulate({ elements: rc }, { tStop: 1e-3, toleranceScale: { nope: 1 } }),
    );
    expect([unknown.net, unknown.field]).toEqual(['nope', 'toleranceScale']);
    const negative = netlistError(() =>
      simulate({ elements: rc }, { tStop: 1e-3, toleranceScale: { f: -1 } }),
    );
    expect(negative.field).toBe('toleranceScale.f');
    expect(negative.message).toContain('≥ 0');
  });

  it('simulate(unknown probe) → NetlistError naming the net', () => {
    expect(
      netlistError(() => simulate({ elements: rc }, { tStop: 1e-3, probes: ['nope'] })).net,
    ).toBe('nope');
  });

  it('simulate(capacitor-only middle node) → accepted: charge fixes its voltage', () => {
    // Decision: capacitively coupled nets are legitimate in a transient from initial conditions.
    const r = simulate(
      {
        elements: [
          {
            kind: 'vsource',
            id: 'V5',
            pos: 'v5',
            neg: '0',
            wave: { kind: 'step', t0: 1e-4, v0: 0, v1: 5 },
          },
          { kind: 'capacitor', id: 'CA', a: 'v5', b: 'm', farads: 1e-6 },
          { kind: 'capacitor', id: 'CB', a: 'm', b: '0', farads: 4e-6 },
        ],
      },
      { tStop: 1e-3 },
    );
    // Series capacitors: v(m) = 5·CA/(CA + CB) = 1 V (closed form).
    expect(r.nets.m[r.nets.m.length - 1]).toBeCloseTo(1, 9);
  });

  it('simulate(net held only by a 1e-300 F capacitor) → SingularMatrixError naming the net', () => {
    const netlist = withElement({ kind: 'capacitor', id: 'CTINY', a: 'f', b: 'x', farads: 1e-300 });
    try {
      simulate(netlist, { tStop: 1e-3 });
      throw new Error('expected a SingularMatrixError');
    } catch (e) {
      expect(e).toBeInstanceOf(SingularMatrixError);
      expect((e as SingularMatrixError).nets).toContain('x');
    }
  });

  it('compiled.run(values with other nets) → NetlistError asking to compile anew', () => {
    const c = compile({ elements: rc });
    const moved = { elements: [rc[0], { ...rc[1], b: 'g' } as Element, rc[2]] };
    expect(netlistError(() => c.run({ tStop: 1e-3 }, moved)).message).toContain('compile it anew');
  });

  it('compiled.run(values with a negative capacitor) → NetlistError naming the part', () => {
    const c = compile({ elements: rc });
    const bad = { elements: [rc[0], rc[1], { ...rc[2], farads: -1e-6 } as Element] };
    expect(netlistError(() => c.run({ tStop: 1e-3 }, bad)).element).toBe('C1');
  });
});
