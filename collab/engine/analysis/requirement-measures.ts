/**
 * One measurement function per requirement kind (see `requirement-eval.ts` for what each
 * relative margin is relative to).
 */
import type { CrossingRef, RequirementSpec } from '../plan/plan-schema';
import type { CrossingPoint } from './result-types';
import {
  describe,
  levelOf,
  locate,
  missing,
  signalOf,
  type EvaluationContext,
  type Measure,
} from './requirement-context';
import {
  crossingTimes,
  differenceExtreme,
  largestDip,
  lastOutsideBand,
  peakSlope,
} from './waveform-ops';

function order(ctx: EvaluationContext, req: Extract<RequirementSpec, { kind: 'order' }>): Measure {
  const a = locate(ctx, req.a);
  const b = locate(ctx, req.b);
  if (a === undefined) return missing('s', describe(ctx, req.a), b === undefined ? [] : [b]);
  if (b === undefined) return missing('s', describe(ctx, req.b), [a]);
  const limit = req.minGap ?? 0;
  const measured = b.time - a.time;
  return {
    unit: 's',
    measured,
    limit,
    margin: measured - limit,
    scale: limit > 0 ? limit : b.time - ctx.windowStart,
    points: [a, b],
  };
}

function delay(ctx: EvaluationContext, req: Extract<RequirementSpec, { kind: 'delay' }>): Measure {
  const from = locate(ctx, req.from);
  if (from === undefined) return missing('s', describe(ctx, req.from));
  const to = locate(ctx, req.to, from.time);
  if (to === undefined)
    return missing('s', `${describe(ctx, req.to)} after ${req.from.signal}`, [from]);
  const measured = to.time - from.time;
  const toMin = req.min === undefined ? Infinity : measured - req.min;
  const toMax = req.max === undefined ? Infinity : req.max - measured;
  const limit = toMin <= toMax ? (req.min ?? 0) : (req.max ?? 0);
  const margin = Math.min(toMin, toMax);
  return {
    unit: 's',
    measured,
    limit,
    margin,
    scale: limit > 0 ? limit : (req.max ?? measured),
    points: [from, to],
  };
}

function separation(
  ctx: EvaluationContext,
  req: Extract<RequirementSpec, { kind: 'separation' }>,
): Measure {
  const a = signalOf(ctx, req.a);
  const b = req.b === undefined ? undefined : signalOf(ctx, req.b);
  const from = req.from === undefined ? undefined : locate(ctx, req.from);
  const to = req.to === undefined ? undefined : locate(ctx, req.to, from?.time ?? ctx.windowStart);
  if (req.from !== undefined && from === undefined) return missing('V', describe(ctx, req.from));
  if (req.to !== undefined && to === undefined) return missing('V', describe(ctx, req.to));
  const t0 = from?.time ?? ctx.windowStart;
  const t1 = to?.time ?? ctx.windowEnd;
  const above = req.relation === 'above';
  const ext = above
    ? differenceExtreme(a.wave, b?.wave, 'min', t0, t1)
    : differenceExtreme(a.wave, b?.wave, 'max', t0, t1);
  const measured = above ? ext.value : -ext.value;
  const points: CrossingPoint[] = [...(from ? [from] : []), ...(to ? [to] : [])];
  points.push({ signal: req.a, level: ext.value, edge: 'rise', time: ext.time });
  const scale = req.by > 0 ? req.by : Math.abs(a.spec.nominal);
  return {
    unit: 'V',
    measured,
    limit: req.by,
    margin: measured - req.by,
    scale,
    points,
    note: 'worst point at the last entry of points',
  };
}

function backDrive(
  ctx: EvaluationContext,
  req: Extract<RequirementSpec, { kind: 'back-drive' }>,
): Measure {
  const pin = signalOf(ctx, req.pin);
  const supply = signalOf(ctx, req.supply);
  const drop = req.drop ?? ctx.settings.backDriveDrop;
  const ext = differenceExtreme(pin.wave, supply.wave, 'max', 0, ctx.windowEnd);
  return {
    unit: 'V',
    measured: ext.value,
    limit: drop,
    margin: drop - ext.value,
    scale: drop,
    points: [{ signal: req.pin, level: ext.value, edge: 'rise', time: ext.time }],
    note: 'measured = largest v(pin) − v(supply) over the whole run',
  };
}

function riseWindow(
  ctx: EvaluationContext,
  id: string,
  from: string | number | undefined,
  to: string | number | undefined,
): [CrossingPoint, CrossingPoint] | string {
  const { spec } = signalOf(ctx, id);
  const lo: CrossingRef = { signal: id, level: from ?? 0.1 * spec.nominal, edge: 'rise' };
  const hi: CrossingRef = { signal: id, level: to ?? 0.9 * spec.nominal, edge: 'rise' };
  const a = locate(ctx, lo);
  if (a === undefined) return describe(ctx, lo);
  const b = locate(ctx, hi, a.time);
  if (b === undefined) return describe(ctx, hi);
  return [a, b];
}

function monotonic(
  ctx: EvaluationContext,
  req: Extract<RequirementSpec, { kind: 'monotonic' }>,
): Measure {
  const w = riseWindow(ctx, req.signal, req.from, req.to);
  if (typeof w === 'string') return missing('V', w);
  const { spec, wave } = signalOf(ctx, req.signal);
  const dip = largestDip(wave, w[0].time, w[1].time);
  const limit = req.allowedDip ?? ctx.settings.monotonicDip * Math.abs(spec.nominal);
  return {
    unit: 'V',
    measured: dip.value,
    limit,
    margin: limit - dip.value,
    scale: limit,
    points: w,
  };
}

function slew(ctx: EvaluationContext, req: Extract<RequirementSpec, { kind: 'slew' }>): Measure {
  const w = riseWindow(ctx, req.signal, req.from, req.to);
  if (typeof w === 'string') return missing('V/s', w);
  const { wave } = signalOf(ctx, req.signal);
  const dt = w[1].time - w[0].time;
  const average = dt > 0 ? (w[1].level - w[0].level) / dt : Infinity;
  const peak = Math.max(
    peakSlope(wave, w[0].time, w[1].time).value,
    Number.isFinite(average) ? average : 0,
  );
  const toMin = req.min === undefined ? Infinity : average - req.min;
  const toMax = req.max === undefined ? Infinity : req.max - peak;
  const useMin = toMin <= toMax;
  const limit = useMin ? (req.min ?? 0) : (req.max ?? 0);
  return {
    unit: 'V/s',
    measured: useMin ? average : peak,
    limit,
    margin: Math.min(toMin, toMax),
    scale: limit,
    points: w,
    note: useMin
      ? 'measured = average slew between the levels'
      : 'measured = steepest slope between the levels',
  };
}

function settle(
  ctx: EvaluationContext,
  req: Extract<RequirementSpec, { kind: 'settle' }>,
): Measure {
  const { spec, wave } = signalOf(ctx, req.signal);
  const target = req.target ?? spec.nominal;
  const last = lastOutsideBand(wave, target, req.band, ctx.windowStart, ctx.windowEnd);
  const endTime = wave.time[wave.time.length - 1];
  if (last >= Math.min(endTime, ctx.windowEnd))
    return missing('s', `${req.signal} is outside ${target} ± ${req.band} V at the end of the run`);
  const measured = last - ctx.windowStart;
  return {
    unit: 's',
    measured,
    limit: req.by,
    margin: req.by - measured,
    scale: req.by,
    points: [{ signal: req.signal, level: target, edge: 'rise', time: last }],
  };
}

function resetHold(
  ctx: EvaluationContext,
  req: Extract<RequirementSpec, { kind: 'reset-hold' }>,
): Measure {
  const reset = signalOf(ctx, req.reset);
  const releaseRef: CrossingRef = {
    signal: req.reset,
    level: req.release ?? 0.5 * reset.spec.nominal,
    edge: 'rise',
  };
  const release = locate(ctx, releaseRef);
  if (release === undefined)
    return missing('s', `${req.reset} is never released (${describe(ctx, releaseRef)})`);
  const points: CrossingPoint[] = [];
  let latest = -Infinity;
  for (const rail of req.rails) {
    const { spec, wave } = signalOf(ctx, rail.signal);
    const { volts, name } = levelOf(spec, rail.level);
    const entries = crossingTimes(wave, volts, 'rise', ctx.windowStart, release.time);
    const t = entries[entries.length - 1];
    if (t === undefined) {
      return {
        unit: 's',
        measured: null,
        limit: req.hold,
        margin: null,
        scale: null,
        points: [release],
        note: `${req.reset} released at ${release.time.toExponential(4)} s before ${rail.signal} reached ${volts} V`,
      };
    }
    points.push({
      signal: rail.signal,
      level: volts,
      edge: 'rise',
      time: t,
      ...(name === undefined ? {} : { threshold: name }),
    });
    latest = Math.max(latest, t);
  }
  points.push(release);
  const measured = release.time - latest;
  return {
    unit: 's',
    measured,
    limit: req.hold,
    margin: measured - req.hold,
    scale: req.hold > 0 ? req.hold : measured,
    points,
  };
}

/** Measures one requirement of any kind. */
export function measure(ctx: EvaluationContext, req: RequirementSpec): Measure {
  switch (req.kind) {
    case 'order':
      return order(ctx, req);
    case 'delay':
      return delay(ctx, req);
    case 'separation':
      return separation(ctx, req);
    case 'back-drive':
      return backDrive(ctx, req);
    case 'monotonic':
      return monotonic(ctx, req);
    case 'slew':
      return slew(ctx, req);
    case 'settle':
      return settle(ctx, req);
    case 'reset-hold':
      return resetHold(ctx, req);
  }
}
