/**
 * The varying parameters of a plan: each toleranced value (a part's main value or a named field
 * of a behavioural block) with its tolerance, distribution and temperature model, and the value
 * it takes at a position in its tolerance band and at a temperature.
 */
import type { Plan } from '../plan/plan-schema';
import type { DistributionSpec, PartSpec, ToleranceSpec } from '../plan/plan-schema-parts';
import { PlanError } from '../plan/plan-errors';
import { dielectricBand } from './dielectric-classes';
import type { DielectricClass } from '../plan/plan-schema-parts';

export type TemperatureModel =
  | { kind: 'none' }
  | { kind: 'tempco'; ppmPerC: number; band: boolean }
  | { kind: 'dielectric'; cls: DielectricClass };

export interface Parameter {
  /** `R7` for a part's main value, `U2.vout` for a field of a block. */
  id: string;
  partId: string;
  field: string;
  nominal: number;
  /** Absolute tolerance bounds at 25 °C; equal to nominal when not toleranced. */
  low: number;
  high: number;
  distribution: { kind: 'uniform' } | { kind: 'normal'; k: number };
  temperature: TemperatureModel;
}

function nominalOf(part: PartSpec, field: string): number {
  if (part.kind === 'supervisor' && field === 'threshold') return 1; // a factor on every monitor
  if (part.kind === 'diode' && field !== 'value') {
    const v = (part.model as Record<string, unknown>)[field];
    if (typeof v === 'number') return v;
  }
  const v = (part as Record<string, unknown>)[field];
  if (typeof v !== 'number')
    throw new PlanError([`part ${part.id}: field ${field} has no numeric value`]);
  return v;
}

function bounds(partId: string, nominal: number, tol: ToleranceSpec | undefined): [number, number] {
  if (tol === undefined) return [nominal, nominal];
  if (tol.percent !== undefined) {
    const d = Math.abs(nominal) * (tol.percent / 100);
    return [nominal - d, nominal + d];
  }
  const low = tol.min ?? nominal;
  const high = tol.max ?? nominal;
  if (low > nominal || high < nominal) {
    throw new PlanError([
      `part ${partId}: tolerance [${low}, ${high}] must contain the nominal ${nominal}`,
    ]);
  }
  return [low, high];
}

function distributionOf(
  spec: DistributionSpec | undefined,
  defaultK: number,
): Parameter['distribution'] {
  if (spec?.kind === 'normal') return { kind: 'normal', k: spec.k ?? defaultK };
  return { kind: 'uniform' };
}

function temperatureOf(part: PartSpec): TemperatureModel {
  if ((part.kind === 'resistor' || part.kind === 'capacitor') && part.temperature !== undefined) {
    const t = part.temperature;
    if (t.kind === 'tempco') return { kind: 'tempco', ppmPerC: t.ppmPerC, band: t.band ?? true };
    return { kind: 'dielectric', cls: t.class };
  }
  return { kind: 'none' };
}

/** Every toleranced or temperature-dependent parameter of the plan, in plan order. */
export function planParameters(plan: Plan, defaultK: number): Parameter[] {
  const out: Parameter[] = [];
  for (const part of plan.parts) {
    if ('tolerance' in part && 'value' in part) {
      const temperature = temperatureOf(part);
      if (part.tolerance !== undefined || temperature.kind !== 'none') {
        const [low, high] = bounds(part.id, part.value, part.tolerance);
        out.push({
          id: part.id,
          partId: part.id,
          field: 'value',
          nominal: part.value,
          low,
          high,
          distribution: distributionOf(part.tolerance?.distribution, defaultK),
          temperature,
        });
      }
    }
    for (const [field, tol] of Object.entries(part.tolerances ?? {})) {
      const nominal = nominalOf(part, field);
      const [low, high] = bounds(part.id, nominal, tol);
      out.push({
        id: `${part.id}.${field}`,
        partId: part.id,
        field,
        nominal,
        low,
        high,
        distribution: distributionOf(tol.distribution, defaultK),
        temperature: { kind: 'none' },
      });
    }
  }
  return out;
}

/** Multiplicative temperature band [low, high] of a parameter at `celsius`. */
export function temperatureBand(p: Parameter, celsius: number): [number, number] {
  const t = p.temperature;
  if (t.kind === 'none') return [1, 1];
  if (t.kind === 'dielectric') return dielectricBand(p.partId, t.cls, celsius);
  const f = t.ppmPerC * 1e-6 * (celsius - 25);
  return t.band ? [1 - Math.abs(f), 1 + Math.abs(f)] : [1 + f, 1 + f];
}

function lerpBand(position: number, low: number, mid: number, high: number): number {
  return position >= 0 ? mid + position * (high - mid) : mid + position * (mid - low);
}

/**
 * Value of a parameter at tolerance position `x` and temperature-band position `y`, both in
 * [−1, 1] (−1 = low extreme, 0 = nominal, +1 = high extreme), at `celsius`.
 */
export function parameterValue(p: Parameter, x: number, y: number, celsius: number): number {
  const base = lerpBand(x, p.low, p.nominal, p.high);
  const [tLow, tHigh] = temperatureBand(p, celsius);
  return base * lerpBand(y, tLow, 1, tHigh);
}

/** Whether the parameter moves at all between its corners at `celsius`. */
export function isVarying(p: Parameter, celsius: number): boolean {
  const [tLow, tHigh] = temperatureBand(p, celsius);
  return p.high > p.low || tHigh > tLow;
}

/** "C4 −20 %" style description of a parameter's value relative to its nominal. */
export function describeDeviation(p: Parameter, value: number): string {
  if (p.nominal === 0) return `${p.id} ${value >= 0 ? '+' : '−'}${Math.abs(value).toPrecision(3)}`;
  const pct = (value / p.nominal - 1) * 100;
  const text = String(Number(Math.abs(pct).toPrecision(3)));
  return `${p.id} ${pct >= 0 ? '+' : '−'}${text} %`;
}
