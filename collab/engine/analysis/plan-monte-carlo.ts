/**
 * Monte Carlo of a plan: each run is one drawn board (the same part draws at every scenario and
 * temperature), simulated in every case; the margins feed exact statistics and yields.
 */
import {
  caseRequirements,
  measureCase,
  simulateCase,
  valuesAt,
  type PreparedPlan,
  type SimulateFn,
} from './plan-runner';
import { mergeChunks, runMonteCarloChunk, slotSamples, type MonteCarloChunk } from './monte-carlo';
import type { MonteCarloRequirementSummary, MonteCarloSummary } from './result-types';
import { summarize } from './statistics';

/**
 * Monte Carlo keeps only margins, and those are measured on the accepted steps (`netWave`), so
 * each run asks for the smallest evenly spaced output the simulator accepts instead of
 * resampling the plan's `outputPoints` that no one reads.
 */
const MEASURE_ONLY_OUTPUT_POINTS = 2;

export interface PlanMonteCarloOptions {
  runs: number;
  seed: number;
  /** Chunk of runs to do here (for splitting across workers); default all. */
  start?: number;
  end?: number;
  onProgress?: (done: number, total: number) => void;
  shouldCancel?: () => boolean;
}

/**
 * Each case's nominal `peaks`: every run's tolerances then refer to the signal's nominal full
 * scale from t = 0, instead of to the microvolts a net holds before it starts rising (where
 * steps would otherwise be held to ~1 µs). Computed the same way in every chunk, so split runs
 * still equal a single one. A case whose nominal run fails gets no scale (its runs then fail or
 * pass on their own).
 */
function nominalPeaks(
  prep: PreparedPlan,
  simulate: SimulateFn,
): Array<Readonly<Record<string, number>> | undefined> {
  const zeros = new Float64Array(prep.parameters.length);
  return prep.cases.map((c) => {
    try {
      const run = simulateCase(prep, c, valuesAt(prep, c, zeros, zeros), simulate, false, 2);
      return run.sim.peaks;
    } catch {
      return undefined;
    }
  });
}

/** Slot layout: for each case, for each applicable requirement, [margin, relative margin]. */
function slotLayout(
  prep: PreparedPlan,
): Array<{ caseIndex: number; requirementId: string; targetMargin: number }> {
  const layout: Array<{ caseIndex: number; requirementId: string; targetMargin: number }> = [];
  prep.cases.forEach((c, caseIndex) => {
    for (const r of caseRequirements(prep, c)) {
      layout.push({
        caseIndex,
        requirementId: r.id,
        targetMargin: r.targetMargin ?? prep.settings.targetMargin,
      });
    }
  });
  return layout;
}

/** Runs a chunk of the plan's Monte Carlo; merge chunks with `mergeChunks`, then summarise. */
export function planMonteCarloChunk(
  prep: PreparedPlan,
  simulate: SimulateFn,
  o: PlanMonteCarloOptions,
): MonteCarloChunk {
  const layout = slotLayout(prep);
  const scales = nominalPeaks(prep, simulate);
  return runMonteCarloChunk({
    parameters: prep.parameters,
    seed: o.seed,
    runs: o.runs,
    start: o.start,
    end: o.end,
    slots: layout.length * 2,
    onProgress: o.onProgress,
    shouldCancel: o.shouldCancel,
    evaluate: ({ x, y }) => {
      const out: number[] = [];
      for (const [i, c] of prep.cases.entries()) {
        const measures = measureCase(
          prep,
          c,
          simulateCase(
            prep,
            c,
            valuesAt(prep, c, x, y),
            simulate,
            false,
            MEASURE_ONLY_OUTPUT_POINTS,
            scales[i],
          ),
        );
        for (const m of measures) out.push(m.margin ?? Number.NaN, m.relativeMargin ?? Number.NaN);
      }
      return out;
    },
  });
}

/** Summaries per (requirement, case) from merged chunks. */
export function summarizePlanMonteCarlo(
  prep: PreparedPlan,
  chunks: readonly MonteCarloChunk[],
  bins = 20,
): MonteCarloSummary {
  const merged = mergeChunks(chunks);
  const layout = slotLayout(prep);
  const runs = merged.end - merged.start;
  const requirements: MonteCarloRequirementSummary[] = layout.map((slot, k) => {
    const margins = slotSamples(merged, 2 * k);
    const relative = slotSamples(merged, 2 * k + 1);
    let unmeasured = 0;
    let pass = 0;
    let target = 0;
    for (let i = 0; i < runs; i++) {
      if (!Number.isFinite(margins[i])) unmeasured++;
      else if (margins[i] >= 0) {
        pass++;
        if (relative[i] >= slot.targetMargin) target++;
      }
    }
    const c = prep.cases[slot.caseIndex];
    return {
      requirementId: slot.requirementId,
      scenarioId: c.scenarioId,
      temperature: c.temperature,
      margin: summarize(margins, bins),
      unmeasured,
      yieldPass: runs > 0 ? pass / runs : 0,
      yieldTarget: runs > 0 ? target / runs : 0,
    };
  });
  return { runs, seed: merged.seed, cancelled: merged.cancelled, requirements };
}

/** Runs and summarises the whole Monte Carlo in this thread. */
export function planMonteCarlo(
  prep: PreparedPlan,
  simulate: SimulateFn,
  o: PlanMonteCarloOptions,
): MonteCarloSummary {
  return summarizePlanMonteCarlo(prep, [planMonteCarloChunk(prep, simulate, o)]);
}
