/** Numeric constants and guarded functions shared by the element models. */

/** Leak conductance (S) across junctions, as SPICE's default gmin. */
export const GMIN = 1e-12;

/** Boltzmann constant over the elementary charge, V/K (CODATA 2018, exact by SI definition). */
const K_OVER_Q = 1.380649e-23 / 1.602176634e-19;

/** Thermal voltage kT/q at `celsius` °C. */
export function thermalVoltage(celsius: number): number {
  return K_OVER_Q * (celsius + 273.15);
}

/** Largest exponent evaluated exactly; beyond it exp is continued linearly to avoid Infinity. */
export const EXP_LIMIT = 80;

/** exp(x) for x ≤ EXP_LIMIT, continued by its tangent above so the result stays finite. */
export function limitedExp(x: number): number {
  if (x <= EXP_LIMIT) return Math.exp(x);
  const e = Math.exp(EXP_LIMIT);
  return e * (1 + x - EXP_LIMIT);
}

/** Derivative of `limitedExp`. */
export function limitedExpSlope(x: number): number {
  return Math.exp(Math.min(x, EXP_LIMIT));
}

/**
 * Leak (S) from every behavioural output to its gnd, so an open output is never a zero pivot;
 * 1 GΩ, well above the pivot threshold even with the stiff instantaneous re-solve.
 */
export const OPEN_LEAK = 1e-9;

/** Copies src into dst; a plain loop beats `TypedArray.set` on a few tens of entries. */
export function copyInto(dst: Float64Array, src: Float64Array): void {
  for (let i = 0; i < src.length; i++) dst[i] = src[i];
}

/**
 * ratio^(−1/(order + 1)), the step factor from an error ratio: square and cube roots for the
 * first- and second-order formulas, since `Math.pow` with a fractional exponent is several
 * times slower and this runs on every step.
 */
export function inverseRoot(ratio: number, order: number): number {
  if (order === 1) return 1 / Math.sqrt(ratio);
  if (order === 2) return 1 / Math.cbrt(ratio);
  return Math.pow(ratio, -1 / (order + 1));
}
