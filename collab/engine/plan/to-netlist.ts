/**
 * Turns a plan, a scenario case and concrete parameter values into the simulator's `Netlist`.
 * The analysis layer owns tolerances and temperature; the simulator sees plain numbers.
 */
import type { Element, Netlist, SourceWaveform } from '../netlist';
import type { Plan } from './plan-schema';
import type { PartSpec, PartWave } from './plan-schema-parts';
import { inputWaveform, type ScenarioCase } from './scenarios';

/** Parameter id → concrete value (for a supervisor's `threshold`, a factor on every monitor). */
export type ParameterValues = ReadonlyMap<string, number>;

function fixedWave(wave: PartWave | undefined, value: number): SourceWaveform {
  if (wave === undefined || wave.kind === 'dc') return { kind: 'dc', value };
  switch (wave.kind) {
    case 'step':
      return { kind: 'step', t0: wave.t0, v0: 0, v1: value };
    case 'ramp':
      return { kind: 'ramp', t0: wave.t0, rise: wave.rise, v0: 0, v1: value };
    case 'pwl':
      return { kind: 'pwl', points: wave.points.map(([t, f]) => [t, f * value] as const) };
    case 'exp':
      return { kind: 'exp', t0: wave.t0, tau: wave.tau, v0: 0, v1: value };
  }
}

/** Copies a part's numeric fields, replacing toleranced ones by their drawn values. */
function withFields<T extends object>(part: PartSpec, base: T, values: ParameterValues): T {
  const out: Record<string, unknown> = { ...(base as Record<string, unknown>) };
  for (const field of Object.keys(part.tolerances ?? {})) {
    const v = values.get(`${part.id}.${field}`);
    if (v !== undefined && field in out) out[field] = v;
  }
  return out as T;
}

function elementOf(part: PartSpec, c: ScenarioCase, values: ParameterValues): Element {
  const main = values.get(part.id);
  switch (part.kind) {
    case 'resistor':
      return { kind: 'resistor', id: part.id, a: part.a, b: part.b, ohms: main ?? part.value };
    case 'capacitor':
      return {
        kind: 'capacitor',
        id: part.id,
        a: part.a,
        b: part.b,
        farads: main ?? part.value,
        v0: part.v0 ?? 0,
      };
    case 'inductor':
      return {
        kind: 'inductor',
        id: part.id,
        a: part.a,
        b: part.b,
        henries: main ?? part.value,
        i0: part.i0 ?? 0,
      };
    case 'vsource': {
      const level = main ?? part.value;
      const wave = part.role === 'input' ? inputWaveform(c, level) : fixedWave(part.wave, level);
      return withFields(
        part,
        { kind: 'vsource', id: part.id, pos: part.pos, neg: part.neg, wave, rs: part.rs ?? 0 },
        values,
      );
    }
    case 'isource':
      return {
        kind: 'isource',
        id: part.id,
        from: part.from,
        to: part.to,
        wave: fixedWave(part.wave, main ?? part.value),
      };
    case 'diode': {
      const model = { ...part.model };
      for (const field of Object.keys(part.tolerances ?? {})) {
        const v = values.get(`${part.id}.${field}`);
        if (v !== undefined && field in model)
          (model as Record<string, number | string>)[field] = v;
      }
      return { kind: 'diode', id: part.id, anode: part.anode, cathode: part.cathode, model };
    }
    case 'comparator': {
      const { label: _l, tolerances: _t, ...rest } = part;
      return withFields(part, rest, values);
    }
    case 'regulator': {
      const { label: _l, tolerances: _t, ...rest } = part;
      return withFields(part, rest, values);
    }
    case 'supervisor': {
      const { label: _l, tolerances: _t, ...rest } = part;
      const factor = values.get(`${part.id}.threshold`) ?? 1;
      const scaled = {
        ...rest,
        monitors: rest.monitors.map((m) => ({ ...m, threshold: m.threshold * factor })),
      };
      return withFields(part, scaled, values);
    }
  }
}

/** The netlist of one case with the given parameter values (missing ones stay nominal). */
export function buildNetlist(plan: Plan, c: ScenarioCase, values: ParameterValues): Netlist {
  return { elements: plan.parts.map((p) => elementOf(p, c, values)), temperature: c.temperature };
}
