/**
 * Percentile bands of the signal curves over Monte Carlo samples. Curves are kept for the first
 * `bandRuns` runs only (memory: runs × signals × points), re-simulated with exactly the draws
 * of those runs, so the bands are reproducible for a seed whatever the worker split.
 */
import { percentileOfSorted } from './statistics';
import { drawRun } from './seeded-draws';
import { simulateCase, valuesAt, type PreparedPlan, type SimulateFn } from './plan-runner';

/** Per case index, per signal id: 5th and 95th percentile curves. */
export type CurveBands = Array<Map<string, { p05: number[]; p95: number[] }>>;

/** Default number of runs whose curves make the bands. */
export const DEFAULT_BAND_RUNS = 64;

/** Computes p05/p95 curves over the first `bandRuns` Monte Carlo runs of `seed`. */
export function monteCarloBands(
  prep: PreparedPlan,
  simulate: SimulateFn,
  seed: number,
  bandRuns: number,
): CurveBands {
  const draws = Array.from({ length: bandRuns }, (_, i) => drawRun(prep.parameters, seed, i));
  return prep.cases.map((c) => {
    const curves = new Map<string, Float64Array[]>();
    for (const { x, y } of draws) {
      const run = simulateCase(prep, c, valuesAt(prep, c, x, y), simulate);
      for (const [id, { spec }] of run.signals) {
        const list = curves.get(id) ?? [];
        list.push(run.sim.nets[spec.net] ?? new Float64Array(0));
        curves.set(id, list);
      }
    }
    const bands = new Map<string, { p05: number[]; p95: number[] }>();
    for (const [id, list] of curves) {
      const points = list[0]?.length ?? 0;
      const column = new Float64Array(list.length);
      const p05: number[] = [];
      const p95: number[] = [];
      for (let k = 0; k < points; k++) {
        list.forEach((curve, r) => (column[r] = curve[k]));
        column.sort();
        p05.push(percentileOfSorted(column, 5));
        p95.push(percentileOfSorted(column, 95));
      }
      bands.set(id, { p05, p95 });
    }
    return bands;
  });
}
