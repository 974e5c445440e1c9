/** The nets each part touches, and which of its pins conduct at DC. */
import type { PartSpec } from './plan-schema-parts';

export interface PartPin {
  pin: string;
  net: string;
}

/** Every (pin, net) pair of a part, in a fixed order. */
export function partPins(part: PartSpec): PartPin[] {
  switch (part.kind) {
    case 'resistor':
    case 'capacitor':
    case 'inductor':
      return [
        { pin: 'a', net: part.a },
        { pin: 'b', net: part.b },
      ];
    case 'vsource':
      return [
        { pin: 'pos', net: part.pos },
        { pin: 'neg', net: part.neg },
      ];
    case 'isource':
      return [
        { pin: 'from', net: part.from },
        { pin: 'to', net: part.to },
      ];
    case 'diode':
      return [
        { pin: 'anode', net: part.anode },
        { pin: 'cathode', net: part.cathode },
      ];
    case 'comparator':
      return [
        { pin: 'inP', net: part.inP },
        { pin: 'inN', net: part.inN },
        { pin: 'supply', net: part.supply },
        { pin: 'gnd', net: part.gnd },
        { pin: 'out', net: part.out },
      ];
    case 'regulator': {
      const pins = [
        { pin: 'input', net: part.input },
        { pin: 'en', net: part.en },
        { pin: 'out', net: part.out },
        { pin: 'gnd', net: part.gnd },
      ];
      return part.pg === undefined ? pins : [...pins, { pin: 'pg', net: part.pg }];
    }
    case 'supervisor':
      return [
        { pin: 'supply', net: part.supply },
        { pin: 'gnd', net: part.gnd },
        { pin: 'out', net: part.out },
        ...part.monitors.map((m) => ({ pin: `monitor ${m.net}`, net: m.net })),
      ];
  }
}

/**
 * Pairs of nets a part joins with a DC path. Behavioural outputs count as paths to their ground
 * pin because they are driven (or pulled low) through a finite resistance; their inputs are
 * high-impedance. Capacitors and current sources never give a DC path.
 */
export function dcPaths(part: PartSpec): Array<readonly [string, string]> {
  switch (part.kind) {
    case 'resistor':
    case 'inductor':
      return [[part.a, part.b]];
    case 'vsource':
      return [[part.pos, part.neg]];
    case 'diode':
      return [[part.anode, part.cathode]];
    case 'comparator':
      return [[part.out, part.gnd]];
    case 'regulator':
      return part.pg === undefined
        ? [[part.out, part.gnd]]
        : [
            [part.out, part.gnd],
            [part.pg, part.gnd],
          ];
    case 'supervisor':
      return [[part.out, part.gnd]];
    case 'capacitor':
    case 'isource':
      return [];
  }
}

/** Pairs of nets a part shorts at DC with zero resistance (ideal sources and inductors). */
export function idealShorts(part: PartSpec): Array<readonly [string, string]> {
  if (part.kind === 'vsource' && !(part.rs !== undefined && part.rs > 0))
    return [[part.pos, part.neg]];
  return [];
}
