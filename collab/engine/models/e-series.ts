/**
 * IEC 60063 preferred-number series (E6…E96) and helpers to sweep them over decades.
 *
 * Tables written from memory of IEC 60063:2015 (values per decade, mantissa in [1, 10)); the
 * tests check them against the standard's known properties and listed values.
 */

export type ESeriesName = 'E6' | 'E12' | 'E24' | 'E48' | 'E96';

const E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6,
  6.2, 6.8, 7.5, 8.2, 9.1,
];

const E96 = [
  1.0, 1.02, 1.05, 1.07, 1.1, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.3, 1.33, 1.37, 1.4, 1.43, 1.47,
  1.5, 1.54, 1.58, 1.62, 1.65, 1.69, 1.74, 1.78, 1.82, 1.87, 1.91, 1.96, 2.0, 2.05, 2.1, 2.15, 2.21,
  2.26, 2.32, 2.37, 2.43, 2.49, 2.55, 2.61, 2.67, 2.74, 2.8, 2.87, 2.94, 3.01, 3.09, 3.16, 3.24,
  3.32, 3.4, 3.48, 3.57, 3.65, 3.74, 3.83, 3.92, 4.02, 4.12, 4.22, 4.32, 4.42, 4.53, 4.64, 4.75,
  4.87, 4.99, 5.11, 5.23, 5.36, 5.49, 5.62, 5.76, 5.9, 6.04, 6.19, 6.34, 6.49, 6.65, 6.81, 6.98,
  7.15, 7.32, 7.5, 7.68, 7.87, 8.06, 8.25, 8.45, 8.66, 8.87, 9.09, 9.31, 9.53, 9.76,
];

/** E12 and E6 take every 2nd and 4th E24 value; E48 every 2nd E96 value (IEC 60063 nesting). */
const TABLES: Record<ESeriesName, readonly number[]> = {
  E6: E24.filter((_, i) => i % 4 === 0),
  E12: E24.filter((_, i) => i % 2 === 0),
  E24,
  E48: E96.filter((_, i) => i % 2 === 0),
  E96,
};

/** Tolerance IEC 60063 associates with each series, percent. */
export const E_SERIES_TOLERANCE: Record<ESeriesName, number> = {
  E6: 20,
  E12: 10,
  E24: 5,
  E48: 2,
  E96: 1,
};

/** The per-decade mantissas of a series, ascending in [1, 10). */
export function eSeriesMantissas(series: ESeriesName): readonly number[] {
  return TABLES[series];
}

/** Rounds away binary noise of mantissa × 10^k (e.g. 4.7 × 1e3 → 4700 exactly). */
function scaled(mantissa: number, exponent: number): number {
  return Number((mantissa * 10 ** exponent).toPrecision(6));
}

/**
 * All values of `series` in [low, high], ascending.
 * @throws RangeError when the range is empty or not positive.
 */
export function eSeriesValues(series: ESeriesName, low: number, high: number): number[] {
  if (!(low > 0 && high >= low && Number.isFinite(high))) {
    throw new RangeError(`E-series range must satisfy 0 < low ≤ high, got [${low}, ${high}]`);
  }
  const values: number[] = [];
  for (let k = Math.floor(Math.log10(low)) - 1; k <= Math.ceil(Math.log10(high)); k++) {
    for (const m of TABLES[series]) {
      const v = scaled(m, k);
      if (v >= low * (1 - 1e-12) && v <= high * (1 + 1e-12)) values.push(v);
    }
  }
  return values;
}

/** The series value nearest to `value` on a log scale. */
export function nearestESeries(series: ESeriesName, value: number): number {
  if (!(value > 0 && Number.isFinite(value)))
    throw new RangeError(`value must be > 0, got ${value}`);
  const candidates = eSeriesValues(series, value / 10, value * 10);
  let best = candidates[0];
  for (const c of candidates)
    if (Math.abs(Math.log(c / value)) < Math.abs(Math.log(best / value))) best = c;
  return best;
}
