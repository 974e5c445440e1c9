/**
 * Scenarios: how the input sources move (power-up, power-down, brown-out dip, slow and fast
 * ramps), for how long a case is simulated, and the window its requirements look at.
 */
import type { SourceWaveform } from '../netlist';
import { DIELECTRIC_CLASSES } from '../models/dielectric-classes';
import type { Plan, ScenarioKind, ScenarioSpec } from './plan-schema';
import type { ResolvedSettings } from './plan-settings';

/** One scenario at one temperature: the unit a simulation runs. */
export interface ScenarioCase {
  scenarioId: string;
  kind: ScenarioKind;
  temperature: number;
  /** Input waveform as fractions of each input source's level: [t, fraction]. */
  inputShape: Array<[number, number]>;
  tStop: number;
  /** Requirements are evaluated on [windowStart, tStop]. */
  windowStart: number;
}

/** Common operating range of the plan's parts, from their dielectric classes, if any. */
export function partTemperatureExtremes(plan: Plan): [number, number] | undefined {
  let lo = -Infinity;
  let hi = Infinity;
  for (const part of plan.parts) {
    if (part.kind === 'capacitor' && part.temperature?.kind === 'dielectric') {
      const r = DIELECTRIC_CLASSES[part.temperature.class];
      lo = Math.max(lo, r.minC);
      hi = Math.min(hi, r.maxC);
    }
  }
  return Number.isFinite(lo) && Number.isFinite(hi) && lo <= hi ? [lo, hi] : undefined;
}

/** Default temperatures: 25 °C plus the parts' extremes (or the plan's listed temperatures). */
export function defaultTemperatures(plan: Plan, settings: ResolvedSettings): number[] {
  const extremes = partTemperatureExtremes(plan) ?? [
    Math.min(...settings.temperatures),
    Math.max(...settings.temperatures),
  ];
  return [...new Set([25, ...extremes])].sort((a, b) => a - b);
}

/** The plan's scenarios, or the default set: power-up and power-down. */
export function planScenarios(plan: Plan): ScenarioSpec[] {
  return (
    plan.scenarios ?? [
      { id: 'power-up', kind: 'power-up' },
      { id: 'power-down', kind: 'power-down' },
    ]
  );
}

function shapeOf(
  s: ScenarioSpec,
  settings: ResolvedSettings,
): Omit<ScenarioCase, 'scenarioId' | 'kind' | 'temperature'> {
  const duration = s.duration ?? settings.duration;
  const fall = s.fall ?? settings.inputFall;
  const rise =
    s.rise ??
    (s.kind === 'slow-ramp'
      ? settings.inputRise * 10
      : s.kind === 'fast-ramp'
        ? settings.inputRise / 10
        : settings.inputRise);
  switch (s.kind) {
    case 'power-up':
    case 'slow-ramp':
    case 'fast-ramp':
      return {
        inputShape: [
          [0, 0],
          [rise, 1],
        ],
        tStop: Math.max(duration, rise * 1.5),
        windowStart: 0,
      };
    case 'power-down': {
      const tDown = rise + duration;
      return {
        inputShape: [
          [0, 0],
          [rise, 1],
          [tDown, 1],
          [tDown + fall, 0],
        ],
        tStop: tDown + duration,
        windowStart: tDown,
      };
    }
    case 'brown-out': {
      const tDip = rise + duration;
      const width = s.dipWidth ?? 1e-3;
      const level = s.dipLevel ?? 0.5;
      return {
        inputShape: [
          [0, 0],
          [rise, 1],
          [tDip, 1],
          [tDip + fall, level],
          [tDip + fall + width, level],
          [tDip + fall + width + rise, 1],
        ],
        tStop: tDip + duration,
        windowStart: tDip,
      };
    }
  }
}

/** Every (scenario, temperature) case of a plan, optionally only the named scenario. */
export function scenarioCases(
  plan: Plan,
  settings: ResolvedSettings,
  only?: string,
): ScenarioCase[] {
  const temps = defaultTemperatures(plan, settings);
  const cases: ScenarioCase[] = [];
  for (const s of planScenarios(plan)) {
    if (only !== undefined && s.id !== only) continue;
    for (const temperature of s.temperatures ?? temps) {
      cases.push({ scenarioId: s.id, kind: s.kind, temperature, ...shapeOf(s, settings) });
    }
  }
  return cases;
}

/** Netlist waveform of an input source of level `value` in a case. */
export function inputWaveform(c: ScenarioCase, value: number): SourceWaveform {
  return { kind: 'pwl', points: c.inputShape.map(([t, f]) => [t, f * value] as const) };
}
