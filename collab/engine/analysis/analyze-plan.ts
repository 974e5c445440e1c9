/**
 * The engine's entry point: validates a plan, simulates every case at nominal, optionally runs
 * the corner analysis and Monte Carlo, and returns the documented result JSON.
 */
import type { Plan } from '../plan/plan-schema';
import { PLAN_SCHEMA_VERSION } from '../plan/plan-limits';
import { closedFormChecks } from './closed-form-checks';
import { analyzeCorners } from './plan-corners';
import { planMonteCarlo } from './plan-monte-carlo';
import { measureCase, preparePlan, simulateCase, valuesAt, type SimulateFn } from './plan-runner';
import type { AnalysisResult, CaseResult, CrossingPoint } from './result-types';
import { crossingTimes } from './waveform-ops';
import { DEFAULT_BAND_RUNS, monteCarloBands } from './monte-carlo-bands';
import type { SampledWaveform } from '../netlist';
import type { SignalSpec } from '../plan/plan-schema';

export interface AnalyzeOptions {
  simulate: SimulateFn;
  /** Run the worst-case corner analysis. */
  corners?: boolean;
  monteCarlo?: {
    runs: number;
    seed: number;
    onProgress?: (done: number, total: number) => void;
    shouldCancel?: () => boolean;
    /** Runs whose curves make the p05/p95 bands (default 64; 0 for none). */
    bandRuns?: number;
  };
  /** Only this scenario's cases. */
  scenario?: string;
}

function signalCrossings(spec: SignalSpec, wave: SampledWaveform, from: number): CrossingPoint[] {
  const out: CrossingPoint[] = [];
  for (const [name, level] of Object.entries(spec.thresholds ?? {})) {
    for (const edge of ['rise', 'fall'] as const) {
      for (const time of crossingTimes(wave, level, edge, from))
        out.push({ signal: spec.id, level, edge, time, threshold: name });
    }
  }
  return out.sort((a, b) => a.time - b.time);
}

/** Analyses a validated plan (see `parsePlan`). */
export function analyzePlan(plan: Plan, options: AnalyzeOptions): AnalysisResult {
  const prep = preparePlan(plan, options.scenario);
  const zeros = new Float64Array(prep.parameters.length);
  const result: AnalysisResult = {
    plan: plan.name,
    schemaVersion: PLAN_SCHEMA_VERSION,
    targetMargin: prep.settings.targetMargin,
    cases: [],
    closedForm: [],
  };
  for (const c of prep.cases) {
    const values = valuesAt(prep, c, zeros, zeros);
    const run = simulateCase(prep, c, values, options.simulate, true);
    const caseResult: CaseResult = {
      scenarioId: c.scenarioId,
      kind: c.kind,
      temperature: c.temperature,
      time: Array.from(run.sim.time),
      curves: [...run.signals.values()].map(({ spec, wave }) => ({
        signal: spec.id,
        nominal: Array.from(wave.values),
      })),
      crossings: [...run.signals.values()].flatMap(({ spec, wave }) =>
        signalCrossings(spec, wave, c.windowStart),
      ),
      requirements: measureCase(prep, c, run),
    };
    result.cases.push(caseResult);
    result.closedForm.push(...closedFormChecks(plan, c, run, values));
  }
  if (options.corners === true) {
    const corners = analyzeCorners(prep, options.simulate);
    result.worstCase = corners.entries;
    corners.envelopes.forEach((env, i) => {
      for (const curve of result.cases[i].curves) {
        const e = env.get(curve.signal);
        if (e === undefined) continue;
        curve.cornerMin = Array.from(e.min);
        curve.cornerMax = Array.from(e.max);
      }
    });
  }
  const mc = options.monteCarlo;
  if (mc !== undefined) {
    result.monteCarlo = planMonteCarlo(prep, options.simulate, mc);
    const bandRuns = Math.min(mc.runs, mc.bandRuns ?? DEFAULT_BAND_RUNS);
    if (bandRuns > 1 && !result.monteCarlo.cancelled) {
      monteCarloBands(prep, options.simulate, mc.seed, bandRuns).forEach((bands, i) => {
        for (const curve of result.cases[i].curves) {
          const b = bands.get(curve.signal);
          if (b !== undefined) Object.assign(curve, b);
        }
      });
    }
  }
  return result;
}
