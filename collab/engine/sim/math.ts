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
