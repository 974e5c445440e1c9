/**
 * What requirement measurements share: the evaluation context and helpers that resolve signals,
 * named levels and crossings.
 */
import type { SampledWaveform } from '../netlist';
import type { CrossingRef, SignalSpec } from '../plan/plan-schema';
import type { ResolvedSettings } from '../plan/plan-settings';
import type { CrossingPoint, RequirementMeasure } from './result-types';
import { firstCrossing, type Edge } from './waveform-ops';

/** What a requirement is evaluated on. */
export interface EvaluationContext {
  signals: ReadonlyMap<string, { spec: SignalSpec; wave: SampledWaveform }>;
  windowStart: number;
  windowEnd: number;
  settings: ResolvedSettings;
}

/** A measurement before pass/target bookkeeping. */
export type Measure = Omit<
  RequirementMeasure,
  'requirementId' | 'kind' | 'pass' | 'meetsTarget' | 'targetMargin' | 'relativeMargin'
>;

export function signalOf(
  ctx: EvaluationContext,
  id: string,
): { spec: SignalSpec; wave: SampledWaveform } {
  const s = ctx.signals.get(id);
  // parsePlan has checked every reference; reaching here means a caller passed partial signals.
  if (s === undefined) throw new RangeError(`signal ${id}: no waveform given to the evaluation`);
  return s;
}

export function levelOf(
  spec: SignalSpec,
  level: string | number,
): { volts: number; name?: string } {
  if (typeof level === 'number') return { volts: level };
  const volts = spec.thresholds?.[level];
  if (volts === undefined) throw new RangeError(`signal ${spec.id}: no threshold named ${level}`);
  return { volts, name: level };
}

export function locate(
  ctx: EvaluationContext,
  ref: CrossingRef,
  after = ctx.windowStart,
): CrossingPoint | undefined {
  const { spec, wave } = signalOf(ctx, ref.signal);
  const { volts, name } = levelOf(spec, ref.level);
  const edge: Edge = ref.edge ?? 'rise';
  const time = firstCrossing(wave, volts, edge, after, ctx.windowEnd);
  if (time === undefined) return undefined;
  return {
    signal: ref.signal,
    level: volts,
    edge,
    time,
    ...(name === undefined ? {} : { threshold: name }),
  };
}

export function describe(ctx: EvaluationContext, ref: CrossingRef): string {
  const { spec } = signalOf(ctx, ref.signal);
  return `${ref.signal} never crosses ${levelOf(spec, ref.level).volts} V ${ref.edge === 'fall' ? 'falling' : 'rising'}`;
}

export const missing = (
  unit: Measure['unit'],
  note: string,
  points: CrossingPoint[] = [],
): Measure => ({
  unit,
  measured: null,
  limit: null,
  margin: null,
  scale: null,
  points,
  note,
});
