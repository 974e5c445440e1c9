/**
 * Value suggestion: sweep one part's value over an IEC 60063 series and report, per value, the
 * worst-case margin of every requirement and whether all of them meet their target margin.
 */
import { eSeriesValues, type ESeriesName } from '../models/e-series';
import { PlanError } from '../plan/plan-errors';
import type { Plan } from '../plan/plan-schema';
import { analyzeCorners } from './plan-corners';
import { preparePlan, type SimulateFn } from './plan-runner';

export interface ValueCandidate {
  value: number;
  /** Every requirement meets its target margin at its worst corner. */
  meetsAllTargets: boolean;
  /** Requirement id → worst relative margin (null = not measurable). */
  worstRelativeMargins: Record<string, number | null>;
  /** The requirement with the lowest relative margin, for a quick reason. */
  limitingRequirement: string | null;
}

export interface ValueSuggestion {
  partId: string;
  series: ESeriesName;
  candidates: ValueCandidate[];
  /** Values meeting every target, ascending. */
  suitable: number[];
}

/**
 * Sweeps `partId` over `series` values in [low, high] (default: the decade centred on its
 * nominal), each with a full corner analysis.
 * @throws PlanError when the part does not exist or has no main value.
 */
export function suggestValues(
  plan: Plan,
  partId: string,
  series: ESeriesName,
  simulate: SimulateFn,
  range?: { low: number; high: number },
): ValueSuggestion {
  const part = plan.parts.find((p) => p.id === partId);
  if (part === undefined) throw new PlanError([`part ${partId}: not in the plan`]);
  if (!(part.kind === 'resistor' || part.kind === 'capacitor' || part.kind === 'inductor')) {
    throw new PlanError([
      `part ${partId}: value suggestion needs a resistor, capacitor or inductor, not a ${part.kind}`,
    ]);
  }
  const low = range?.low ?? part.value / Math.sqrt(10);
  const high = range?.high ?? part.value * Math.sqrt(10);
  const candidates: ValueCandidate[] = [];
  for (const value of eSeriesValues(series, low, high)) {
    const variant: Plan = {
      ...plan,
      parts: plan.parts.map((p) =>
        p.id === partId
          ? { ...part, value, tolerance: rescaled(part.tolerance, part.value, value) }
          : p,
      ),
    };
    const entries = analyzeCorners(preparePlan(variant), simulate).entries;
    const worstRelativeMargins: Record<string, number | null> = {};
    let meetsAllTargets = true;
    let limiting: { id: string; m: number } | null = null;
    for (const e of entries) {
      const rel = e.worst?.relativeMargin ?? null;
      worstRelativeMargins[e.requirementId] = rel;
      if (e.worst === null || !e.worst.meetsTarget) meetsAllTargets = false;
      const m = rel ?? -Infinity;
      if (limiting === null || m < limiting.m) limiting = { id: e.requirementId, m };
    }
    candidates.push({
      value,
      meetsAllTargets,
      worstRelativeMargins,
      limitingRequirement: limiting?.id ?? null,
    });
  }
  return {
    partId,
    series,
    candidates,
    suitable: candidates.filter((c) => c.meetsAllTargets).map((c) => c.value),
  };
}

/** Keeps an absolute min/max tolerance proportional when the nominal value changes. */
function rescaled<T extends { min?: number; max?: number }>(
  tol: T | undefined,
  from: number,
  to: number,
): T | undefined {
  if (tol === undefined || tol.min === undefined || tol.max === undefined) return tol;
  return { ...tol, min: (tol.min * to) / from, max: (tol.max * to) / from };
}
