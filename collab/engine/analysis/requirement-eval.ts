/**
 * Evaluates a plan's requirements on sampled waveforms of its signals. Works on any
 * `SampledWaveform`, so bench captures are checked by the same code as simulations.
 *
 * Relative margins (margin / scale) per kind: order → minGap, or the time B starts rising after
 * the window start; delay → the binding limit; separation → `by`, or the signal's nominal;
 * back-drive → the allowed drop; monotonic → the allowed dip; slew → the binding limit;
 * settle → `by`; reset-hold → `hold`, or the measured hold when `hold` is 0.
 */
import type { RequirementSpec, ScenarioKind } from '../plan/plan-schema';
import type { EvaluationContext } from './requirement-context';
import { measure } from './requirement-measures';
import type { RequirementMeasure } from './result-types';

export type { EvaluationContext } from './requirement-context';

/** Scenario kinds a requirement applies to when it does not say. */
export function appliesTo(req: RequirementSpec, kind: ScenarioKind): boolean {
  if (req.during !== undefined) return req.during.includes(kind);
  if (req.kind === 'separation' || req.kind === 'back-drive') return true;
  return kind === 'power-up' || kind === 'slow-ramp' || kind === 'fast-ramp';
}

const finiteOrNull = (v: number | null): number | null =>
  v !== null && Number.isFinite(v) ? v : null;

/** Measures one requirement on the given signals. Never returns NaN: missing values are null. */
export function evaluateRequirement(
  ctx: EvaluationContext,
  req: RequirementSpec,
): RequirementMeasure {
  const m = measure(ctx, req);
  const targetMargin = req.targetMargin ?? ctx.settings.targetMargin;
  const margin = finiteOrNull(m.margin);
  const scale = finiteOrNull(m.scale);
  const relativeMargin = margin !== null && scale !== null && scale > 0 ? margin / scale : null;
  const pass = margin !== null && margin >= 0;
  return {
    requirementId: req.id,
    kind: req.kind,
    ...m,
    measured: finiteOrNull(m.measured),
    limit: finiteOrNull(m.limit),
    margin,
    scale,
    relativeMargin,
    pass,
    meetsTarget: pass && relativeMargin !== null && relativeMargin >= targetMargin,
    targetMargin,
  };
}
