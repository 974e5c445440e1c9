/** Plan settings with their defaults filled in. */
import type { Plan } from './plan-schema';

export interface ResolvedSettings {
  /** @default 0.3 */
  targetMargin: number;
  /** @default 1e-3 s */
  inputRise: number;
  /** @default 1e-3 s */
  inputFall: number;
  /** @default 20e-3 s */
  duration: number;
  /** @default 2000 */
  outputPoints: number;
  /** @default 3 */
  normalK: number;
  /** @default 0.3 V (a Schottky-like clamp; 0.6–0.7 V for a silicon one) */
  backDriveDrop: number;
  /** @default 0.01 (1 % of nominal) */
  monotonicDip: number;
  /** @default [25] */
  temperatures: number[];
}

/** Fills the defaults of a plan's settings. */
export function resolveSettings(plan: Plan): ResolvedSettings {
  const s = plan.settings ?? {};
  return {
    targetMargin: s.targetMargin ?? 0.3,
    inputRise: s.inputRise ?? 1e-3,
    inputFall: s.inputFall ?? 1e-3,
    duration: s.duration ?? 20e-3,
    outputPoints: Math.round(s.outputPoints ?? 2000),
    normalK: s.normalK ?? 3,
    backDriveDrop: s.backDriveDrop ?? 0.3,
    monotonicDip: s.monotonicDip ?? 0.01,
    temperatures: s.temperatures ?? [25],
  };
}
