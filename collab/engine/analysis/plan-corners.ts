/**
 * Worst-case analysis of a plan: per case (scenario × temperature, so temperature is an extra
 * axis) every tolerance corner of the varying parameters, then per requirement the worst margin
 * over all cases with the part extremes that produce it.
 */
import { isVarying } from '../models/parameters';
import type { ScenarioCase } from '../plan/scenarios';
import {
  caseRequirements,
  cornerLabel,
  measureCase,
  simulateCase,
  valuesAt,
  type PreparedPlan,
  type SimulateFn,
} from './plan-runner';
import type { RequirementMeasure, WorstCaseEntry } from './result-types';
import { worstCase } from './worst-case';

/** Per-signal min/max envelopes over corners, keyed by signal id. */
export type Envelopes = Map<string, { min: Float64Array; max: Float64Array }>;

export interface PlanCornersOutcome {
  entries: WorstCaseEntry[];
  /** Envelopes per case index. */
  envelopes: Envelopes[];
}

function updateEnvelope(env: Envelopes, run: ReturnType<typeof simulateCase>): void {
  for (const [id, { spec }] of run.signals) {
    const wave = { values: run.sim.nets[spec.net] ?? new Float64Array(0) };
    const e = env.get(id);
    if (e === undefined) {
      env.set(id, { min: Float64Array.from(wave.values), max: Float64Array.from(wave.values) });
      continue;
    }
    for (let i = 0; i < e.min.length; i++) {
      const v = wave.values[i];
      if (v < e.min[i]) e.min[i] = v;
      if (v > e.max[i]) e.max[i] = v;
    }
  }
}

function worseMeasure(a: RequirementMeasure, b: RequirementMeasure | null): boolean {
  if (b === null) return true;
  if (a.margin === null) return b.margin !== null;
  return b.margin !== null && a.margin < b.margin;
}

/** The corner's values restricted to the parameters that moved this margin (others dropped). */
function influentialOnly(
  values: ReadonlyMap<string, number>,
  varying: ReadonlyArray<{ p: { id: string } }>,
  influential: readonly boolean[],
): Map<string, number> {
  const keep = new Set(varying.filter((_, k) => influential[k]).map(({ p }) => p.id));
  return new Map([...values].filter(([id]) => keep.has(id)));
}

/** Runs the corner analysis over every case of the prepared plan. */
export function analyzeCorners(prep: PreparedPlan, simulate: SimulateFn): PlanCornersOutcome {
  const entries = new Map<string, WorstCaseEntry>();
  const envelopes: Envelopes[] = [];
  for (const c of prep.cases) {
    const env: Envelopes = new Map();
    envelopes.push(env);
    const reqs = caseRequirements(prep, c);
    const varying = prep.parameters
      .map((p, i) => ({ p, i }))
      .filter(({ p }) => isVarying(p, c.temperature));
    const full = (positions: ArrayLike<number>): Float64Array => {
      const x = new Float64Array(prep.parameters.length);
      varying.forEach(({ i }, k) => (x[i] = positions[k]));
      return x;
    };
    const run = (positions: ArrayLike<number>) => {
      const x = full(positions);
      const values = valuesAt(prep, c, x, x);
      const caseRun = simulateCase(prep, c, values, simulate);
      updateEnvelope(env, caseRun);
      return { values, measures: measureCase(prep, c, caseRun) };
    };
    const outcome = worstCase(varying.length, reqs.length, (positions) =>
      run(positions).measures.map((m) => m.margin),
    );
    const nominalRun = run(new Float64Array(varying.length));
    reqs.forEach((req, s) => {
      const slot = outcome.slots[s];
      const worst = run(slot.positions);
      const nominal = nominalRun.measures[s];
      const candidate: WorstCaseEntry = {
        requirementId: req.id,
        nominal,
        worst: worst.measures[s],
        scenarioId: c.scenarioId,
        temperature: c.temperature,
        corner: Object.fromEntries(
          [...worst.values].filter(([id]) => varying.some(({ p }) => p.id === id)),
        ),
        cornerLabel: `${c.scenarioId}: ${cornerLabel(prep, influentialOnly(worst.values, varying, slot.influential), c.temperature)}`,
        rssMargin: slot.rss,
        method: outcome.method,
        cornersEvaluated: outcome.cornersEvaluated,
      };
      const prev = entries.get(req.id);
      if (prev === undefined || worseMeasure(candidate.worst as RequirementMeasure, prev.worst)) {
        if (prev !== undefined) {
          candidate.cornersEvaluated += prev.cornersEvaluated;
          if (prev.rssMargin === null || (slot.rss !== null && prev.rssMargin < slot.rss))
            candidate.rssMargin = prev.rssMargin;
        }
        entries.set(req.id, candidate);
      } else {
        prev.cornersEvaluated += outcome.cornersEvaluated;
        if (prev.rssMargin !== null && (slot.rss === null || slot.rss < prev.rssMargin))
          prev.rssMargin = slot.rss;
      }
    });
  }
  const ordered = prep.plan.requirements
    .map((r) => entries.get(r.id))
    .filter((e): e is WorstCaseEntry => e !== undefined);
  return { entries: ordered, envelopes };
}

/** Convenience for value suggestion: the worst margin of every requirement over all cases. */
export function worstMargins(
  prep: PreparedPlan,
  simulate: SimulateFn,
): Map<string, RequirementMeasure | null> {
  const out = new Map<string, RequirementMeasure | null>();
  for (const e of analyzeCorners(prep, simulate).entries) out.set(e.requirementId, e.worst);
  return out;
}

export type { ScenarioCase };
