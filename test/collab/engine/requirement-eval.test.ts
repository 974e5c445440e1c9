import {
  evaluateRequirement,
  type EvaluationContext,
} from '@rampart/collab/engine/analysis/requirement-eval';
import { rcDelayToThreshold, rcStepResponse } from '@rampart/collab/engine/analysis/closed-form';
import type { RequirementSpec, SignalSpec } from '@rampart/collab/engine/plan/plan-schema';
import type { SampledWaveform } from '@rampart/collab/engine/netlist';
import { resolveSettings } from '@rampart/collab/engine/plan/plan-settings';

const N = 20001;
const T = 20e-3;
const time = Float64Array.from({ length: N }, (_, i) => (i * T) / (N - 1));

/** A waveform sampled like a bench capture: any function of time. */
function sampled(f: (t: number) => number): SampledWaveform {
  return { time, values: time.map(f) };
}

function signal(id: string, nominal: number, thresholds: Record<string, number>): SignalSpec {
  return { id, kind: 'rail', net: id, nominal, thresholds };
}

const settings = resolveSettings({
  schemaVersion: 1,
  name: 'x',
  nets: [],
  parts: [],
  signals: [],
  requirements: [],
});

function ctx(waves: Array<[SignalSpec, SampledWaveform]>): EvaluationContext {
  return {
    signals: new Map(waves.map(([spec, wave]) => [spec.id, { spec, wave }])),
    windowStart: 0,
    windowEnd: T,
    settings,
  };
}

// Closed-form RC charge (circuit theory): a starts at t = 1 ms with τ = 1 ms to 5 V,
// b starts at t = 4 ms with τ = 0.5 ms to 3.3 V.
const tauA = 1e-3;
const tauB = 0.5e-3;
const a = signal('a', 5, { good: 4.5, start: 0.5 });
const b = signal('b', 3.3, { start: 0.33, good: 3.0 });
const waveA = sampled((t) => rcStepResponse(t - 1e-3, tauA, 5));
const waveB = sampled((t) => rcStepResponse(t - 4e-3, tauB, 3.3));
const both = ctx([
  [a, waveA],
  [b, waveB],
]);

describe('evaluateRequirement', () => {
  it('delay a.start → b.good → the closed-form delay within 1e-9 s, with its margin to max', () => {
    const req: RequirementSpec = {
      id: 'd',
      kind: 'delay',
      from: { signal: 'a', level: 'start' },
      to: { signal: 'b', level: 'good' },
      max: 6e-3,
    };
    const m = evaluateRequirement(both, req);
    const expected =
      4e-3 +
      (rcDelayToThreshold(tauB, 3.0, 3.3) ?? 0) -
      (1e-3 + (rcDelayToThreshold(tauA, 0.5, 5) ?? 0));
    expect(m.measured).toBeCloseTo(expected, 9);
    expect(m.margin).toBeCloseTo(6e-3 - expected, 9);
    expect(m.relativeMargin).toBeCloseTo((6e-3 - expected) / 6e-3, 6);
    expect(m.pass).toBe(true);
    expect(m.points.map((p) => p.signal)).toEqual(['a', 'b']);
  });

  it('order a.good before b.start with minGap 0.5 ms → gap = 4 ms − t(4.5 V), passes', () => {
    const req: RequirementSpec = {
      id: 'o',
      kind: 'order',
      a: { signal: 'a', level: 'good' },
      b: { signal: 'b', level: 'start' },
      minGap: 0.5e-3,
    };
    const m = evaluateRequirement(both, req);
    const tA = 1e-3 + (rcDelayToThreshold(tauA, 4.5, 5) ?? 0);
    const tB = 4e-3 + (rcDelayToThreshold(tauB, 0.33, 3.3) ?? 0);
    expect(m.measured).toBeCloseTo(tB - tA, 9);
    expect(m.margin).toBeCloseTo(tB - tA - 0.5e-3, 9);
    expect(m.meetsTarget).toBe((tB - tA - 0.5e-3) / 0.5e-3 >= 0.3);
  });

  it('order with a level never reached → measured null, pass false, note names the signal', () => {
    const req: RequirementSpec = {
      id: 'o',
      kind: 'order',
      a: { signal: 'a', level: 6 },
      b: { signal: 'b', level: 'start' },
    };
    const m = evaluateRequirement(both, req);
    expect(m.measured).toBeNull();
    expect(m.margin).toBeNull();
    expect(m.pass).toBe(false);
    expect(m.note).toMatch(/a never crosses 6 V rising/);
  });

  it('back-drive with b 0.2 V above its supply a at t = 0.5 ms → margin 0.3 − 0.2 V', () => {
    const supply = signal('s', 3.3, {});
    const pin = signal('p', 3.3, {});
    const c = ctx([
      [supply, sampled((t) => (t < 1e-3 ? 0 : 3.3))],
      [pin, sampled((t) => (t < 1e-3 ? 0.2 : 3.3))],
    ]);
    const m = evaluateRequirement(c, { id: 'bd', kind: 'back-drive', pin: 'p', supply: 's' });
    expect(m.measured).toBeCloseTo(0.2, 12);
    expect(m.margin).toBeCloseTo(0.1, 12);
    expect(m.relativeMargin).toBeCloseTo(1 / 3, 12);
  });

  it('monotonic on a rise with a 50 mV dip → dip 0.05 V, fails the default 1 % (33 mV)', () => {
    const s = signal('r', 3.3, {});
    const c = ctx([
      [
        s,
        sampled(
          (t) =>
            Math.min(3.3, (t / 5e-3) * 3.3) -
            (t > 2e-3 && t < 2.5e-3 ? 0.05 + (t - 2e-3) * (3.3 / 5e-3) : 0),
        ),
      ],
    ]);
    const m = evaluateRequirement(c, { id: 'm', kind: 'monotonic', signal: 'r' });
    expect(m.measured).toBeGreaterThan(0.049);
    expect(m.measured).toBeLessThan(0.4);
    expect(m.limit).toBeCloseTo(0.033, 12);
    expect(m.pass).toBe(false);
  });

  it('slew of a 5 V linear ramp over 2 ms with max 10 V/ms → peak 2.5 V/ms, margin 75 %', () => {
    const s = signal('v', 5, {});
    const c = ctx([[s, sampled((t) => Math.min(5, Math.max(0, (t - 1e-3) / 2e-3) * 5))]]);
    const m = evaluateRequirement(c, { id: 's', kind: 'slew', signal: 'v', max: 1e4 });
    expect(m.measured).toBeCloseTo(2500, 3);
    expect(m.relativeMargin).toBeCloseTo(0.75, 6);
  });

  it('settle of an RC charge into a 1 % band → t = 1 ms + τ·ln(100), margin to 10 ms', () => {
    const m = evaluateRequirement(both, {
      id: 'st',
      kind: 'settle',
      signal: 'a',
      band: 0.05,
      by: 10e-3,
    });
    const expected = 1e-3 + tauA * Math.log(5 / 0.05);
    expect(m.measured).toBeCloseTo(expected, 5);
    expect(m.margin).toBeCloseTo(10e-3 - expected, 5);
  });

  it('reset-hold released 6 ms after the last rail → measured 6 ms, margin 1 ms against 5 ms', () => {
    const reset = signal('rst', 3.3, { released: 1.65 });
    const tRail = 4e-3 + (rcDelayToThreshold(tauB, 3.0, 3.3) ?? 0);
    const c = ctx([
      [a, waveA],
      [b, waveB],
      [reset, sampled((t) => (t >= tRail + 6e-3 ? 3.3 : 0))],
    ]);
    const req: RequirementSpec = {
      id: 'rh',
      kind: 'reset-hold',
      reset: 'rst',
      release: 'released',
      rails: [
        { signal: 'a', level: 'good' },
        { signal: 'b', level: 'good' },
      ],
      hold: 5e-3,
    };
    const m = evaluateRequirement(c, req);
    expect(m.measured).toBeGreaterThan(6e-3 - 2e-6);
    expect(m.measured).toBeLessThan(6e-3 + 2e-6);
    expect(m.margin).toBeCloseTo((m.measured ?? 0) - 5e-3, 12);
    expect(m.points.map((p) => p.signal)).toEqual(['a', 'b', 'rst']);
  });

  it('separation a above b by 1 V after b.good → min(a − b) = 5 − 3.3 minus the tail of a', () => {
    const req: RequirementSpec = {
      id: 'sp',
      kind: 'separation',
      a: 'a',
      b: 'b',
      relation: 'above',
      by: 1,
      from: { signal: 'b', level: 'good' },
    };
    const m = evaluateRequirement(both, req);
    const tFrom = 4e-3 + (rcDelayToThreshold(tauB, 3.0, 3.3) ?? 0);
    const expected = Math.min(
      ...Array.from(time)
        .filter((t) => t >= tFrom)
        .map((t) => rcStepResponse(t - 1e-3, tauA, 5) - rcStepResponse(t - 4e-3, tauB, 3.3)),
    );
    expect(m.measured).toBeCloseTo(expected, 4);
    expect(m.margin).toBeCloseTo(expected - 1, 4);
  });
});
