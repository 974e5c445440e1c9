/**
 * Seeded Monte Carlo over a plan's parameters, independent of what is evaluated. Runs are
 * numbered; run i draws from (seed, i) only, so any split into [start, end) chunks — across
 * workers or calls — merges into exactly the single-run samples.
 */
import type { Parameter } from '../models/parameters';
import { AnalysisLimitError } from '../plan/plan-errors';
import { LIMITS } from '../plan/plan-limits';
import { drawRun, type RunPositions } from './seeded-draws';

/** Evaluates one drawn board; returns one number per metric slot (NaN = not measurable). */
export type RunEvaluator = (positions: RunPositions, runIndex: number) => ArrayLike<number>;

export interface MonteCarloOptions {
  parameters: readonly Parameter[];
  seed: number;
  /** Total runs of the whole analysis (for the limit and for progress). */
  runs: number;
  /** Chunk of runs to do here; default the whole [0, runs). */
  start?: number;
  end?: number;
  slots: number;
  evaluate: RunEvaluator;
  /** Called every `progressEvery` runs and at the end with (done, total). */
  onProgress?: (done: number, total: number) => void;
  progressEvery?: number;
  /** Polled between runs; returning true stops after the current run. */
  shouldCancel?: () => boolean;
}

/** Samples of a chunk of runs: `samples[(run − start)·slots + slot]`. */
export interface MonteCarloChunk {
  seed: number;
  slots: number;
  start: number;
  /** One past the last run done (less than the requested end when cancelled). */
  end: number;
  cancelled: boolean;
  samples: Float64Array;
}

/** Checks the run count against the stated limit. */
export function assertRunCount(runs: number): void {
  if (!(Number.isInteger(runs) && runs >= 1 && runs <= LIMITS.maxMonteCarloRuns)) {
    throw new AnalysisLimitError(
      `Monte Carlo runs must be an integer from 1 to ${LIMITS.maxMonteCarloRuns}, got ${runs}`,
    );
  }
}

/** Runs a chunk of a Monte Carlo analysis. */
export function runMonteCarloChunk(o: MonteCarloOptions): MonteCarloChunk {
  assertRunCount(o.runs);
  const start = o.start ?? 0;
  const end = o.end ?? o.runs;
  if (!(
    Number.isInteger(start) &&
    Number.isInteger(end) &&
    0 <= start &&
    start <= end &&
    end <= o.runs
  )) {
    throw new AnalysisLimitError(
      `Monte Carlo chunk [${start}, ${end}) must lie inside [0, ${o.runs})`,
    );
  }
  const samples = new Float64Array((end - start) * o.slots).fill(Number.NaN);
  const every = o.progressEvery ?? 100;
  let run = start;
  let cancelled = false;
  for (; run < end; run++) {
    if (o.shouldCancel?.() === true) {
      cancelled = true;
      break;
    }
    const values = o.evaluate(drawRun(o.parameters, o.seed, run), run);
    const base = (run - start) * o.slots;
    for (let s = 0; s < o.slots; s++) samples[base + s] = values[s];
    if (o.onProgress !== undefined && (run - start + 1) % every === 0)
      o.onProgress(run - start + 1, end - start);
  }
  o.onProgress?.(run - start, end - start);
  return {
    seed: o.seed,
    slots: o.slots,
    start,
    end: run,
    cancelled,
    samples: samples.subarray(0, (run - start) * o.slots),
  };
}

/**
 * Joins chunks into one, in run order.
 * @throws AnalysisLimitError when chunks overlap, leave a gap or mix seeds.
 */
export function mergeChunks(chunks: readonly MonteCarloChunk[]): MonteCarloChunk {
  if (chunks.length === 0) throw new AnalysisLimitError('no Monte Carlo chunks to merge');
  const sorted = [...chunks].sort((a, b) => a.start - b.start);
  const { seed, slots } = sorted[0];
  let at = sorted[0].start;
  for (const c of sorted) {
    if (c.seed !== seed || c.slots !== slots)
      throw new AnalysisLimitError('Monte Carlo chunks come from different analyses');
    if (c.start !== at)
      throw new AnalysisLimitError(`Monte Carlo chunks leave a gap or overlap at run ${at}`);
    at = c.end;
  }
  const samples = new Float64Array((at - sorted[0].start) * slots);
  let offset = 0;
  for (const c of sorted) {
    samples.set(c.samples, offset);
    offset += c.samples.length;
  }
  return {
    seed,
    slots,
    start: sorted[0].start,
    end: at,
    cancelled: sorted.some((c) => c.cancelled),
    samples,
  };
}

/** The samples of one slot across the chunk's runs. */
export function slotSamples(chunk: MonteCarloChunk, slot: number): Float64Array {
  const n = chunk.end - chunk.start;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = chunk.samples[i * chunk.slots + slot];
  return out;
}
