/**
 * Statistics of Monte Carlo samples: Welford's running mean and variance while a run streams,
 * and an exact summary (order-statistic percentiles, histogram) from the samples kept in run
 * order, so a split across workers gives bit-identical results to a single run.
 */
import type { StatisticsSummary } from './result-types';

/** Welford's online mean/variance with min and max; NaN samples are skipped. */
export class RunningStats {
  count = 0;
  mean = 0;
  private m2 = 0;
  min = Infinity;
  max = -Infinity;

  push(x: number): void {
    if (!Number.isFinite(x)) return;
    this.count++;
    const d = x - this.mean;
    this.mean += d / this.count;
    this.m2 += d * (x - this.mean);
    if (x < this.min) this.min = x;
    if (x > this.max) this.max = x;
  }

  /** Sample standard deviation (n − 1); 0 for fewer than two samples. */
  get sigma(): number {
    return this.count > 1 ? Math.sqrt(this.m2 / (this.count - 1)) : 0;
  }
}

/** Percentile p ∈ [0, 100] of sorted samples, linear between closest ranks. */
export function percentileOfSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return 0;
  const rank = (p / 100) * (n - 1);
  const lo = Math.floor(rank);
  const hi = Math.min(n - 1, lo + 1);
  return sorted[lo] + (sorted[hi] - sorted[lo]) * (rank - lo);
}

/** Equal-width histogram of finite samples over [min, max]. */
export function histogram(
  samples: ArrayLike<number>,
  min: number,
  max: number,
  bins: number,
): { edges: number[]; counts: number[] } {
  const width = max > min ? (max - min) / bins : 1;
  const edges = Array.from({ length: bins + 1 }, (_, i) => min + i * width);
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < samples.length; i++) {
    const x = samples[i];
    if (!Number.isFinite(x)) continue;
    counts[Math.min(bins - 1, Math.max(0, Math.floor((x - min) / width)))]++;
  }
  return { edges, counts };
}

export const REPORTED_PERCENTILES = [0.1, 1, 5, 50, 95, 99, 99.9];

/** Summary of the finite samples, or null when there are none. */
export function summarize(samples: ArrayLike<number>, bins = 20): StatisticsSummary | null {
  const stats = new RunningStats();
  const finite: number[] = [];
  for (let i = 0; i < samples.length; i++) {
    const x = samples[i];
    if (Number.isFinite(x)) {
      stats.push(x);
      finite.push(x);
    }
  }
  if (stats.count === 0) return null;
  const sorted = Float64Array.from(finite).sort();
  const percentiles: Record<string, number> = {};
  for (const p of REPORTED_PERCENTILES) percentiles[`p${p}`] = percentileOfSorted(sorted, p);
  return {
    count: stats.count,
    mean: stats.mean,
    sigma: stats.sigma,
    min: stats.min,
    max: stats.max,
    percentiles,
    histogram: histogram(sorted, stats.min, stats.max, bins),
  };
}
