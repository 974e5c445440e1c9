/**
 * EIA-198 ceramic dielectric classes: temperature range and the capacitance change allowed over
 * it, relative to 25 °C. Written from memory of the EIA-198 letter code (first letter = low
 * temperature X −55 °C / Y −30 °C, digit = high temperature 5 +85 °C / 6 +105 °C / 7 +125 °C,
 * last letter = change R ±15 %, S ±22 %, V +22/−82 %); class I C0G (= NP0) is 0 ± 30 ppm/°C
 * over −55…125 °C.
 */
import type { DielectricClass } from '../plan/plan-schema-parts';
import { PlanError } from '../plan/plan-errors';

export interface DielectricRange {
  minC: number;
  maxC: number;
  /** Largest fall and rise of capacitance over the range, fractions (0.15 = 15 %). */
  maxFall: number;
  maxRise: number;
  /** Class I: a ± tempco band instead of a percentage over the range. */
  ppmPerC?: number;
}

export const DIELECTRIC_CLASSES: Record<DielectricClass, DielectricRange> = {
  C0G: { minC: -55, maxC: 125, maxFall: 0, maxRise: 0, ppmPerC: 30 },
  NP0: { minC: -55, maxC: 125, maxFall: 0, maxRise: 0, ppmPerC: 30 },
  X5R: { minC: -55, maxC: 85, maxFall: 0.15, maxRise: 0.15 },
  X7R: { minC: -55, maxC: 125, maxFall: 0.15, maxRise: 0.15 },
  X6S: { minC: -55, maxC: 105, maxFall: 0.22, maxRise: 0.22 },
  Y5V: { minC: -30, maxC: 85, maxFall: 0.82, maxRise: 0.22 },
};

/**
 * Multiplicative band [low, high] of capacitance at `celsius` relative to its 25 °C value.
 *
 * The standard bounds the change over the whole range, not its shape; we scale the bound
 * linearly with the distance from 25 °C to the range edge on that side (a modelling choice, so
 * that 25 °C is exact and the edge reaches the full published change).
 * @throws PlanError when the temperature is outside the class's range, naming the part.
 */
export function dielectricBand(
  partId: string,
  cls: DielectricClass,
  celsius: number,
): [number, number] {
  const r = DIELECTRIC_CLASSES[cls];
  if (celsius < r.minC || celsius > r.maxC) {
    throw new PlanError([
      `part ${partId}: ${celsius} °C is outside the ${cls} range ${r.minC}…${r.maxC} °C`,
    ]);
  }
  const dT = celsius - 25;
  if (r.ppmPerC !== undefined) {
    const d = r.ppmPerC * 1e-6 * Math.abs(dT);
    return [1 - d, 1 + d];
  }
  const frac = dT >= 0 ? dT / (r.maxC - 25) : dT / (r.minC - 25);
  return [1 - r.maxFall * frac, 1 + r.maxRise * frac];
}
