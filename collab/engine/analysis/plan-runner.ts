/**
 * Runs one case of a plan (a scenario at a temperature) with given parameter positions: builds
 * the netlist, calls the simulator, and measures the requirements on the signal waveforms.
 */
import type { Netlist, SampledWaveform, SimOptions, SimResult } from '../netlist';
import {
  describeDeviation,
  parameterValue,
  planParameters,
  type Parameter,
} from '../models/parameters';
import { AnalysisLimitError, SimulationFailedError } from '../plan/plan-errors';
import { LIMITS } from '../plan/plan-limits';
import type { Plan, RequirementSpec, SignalSpec } from '../plan/plan-schema';
import { resolveSettings, type ResolvedSettings } from '../plan/plan-settings';
import { scenarioCases, type ScenarioCase } from '../plan/scenarios';
import { buildNetlist } from '../plan/to-netlist';
import { appliesTo, evaluateRequirement } from './requirement-eval';
import type { RequirementMeasure } from './result-types';

/** The simulator entry point the analysis calls (the `sim/` module's `simulate`, or a compiled form). */
export type SimulateFn = (netlist: Netlist, options: SimOptions) => SimResult;

/** A validated plan with everything derived once. */
export interface PreparedPlan {
  plan: Plan;
  settings: ResolvedSettings;
  parameters: Parameter[];
  cases: ScenarioCase[];
}

/** Derives settings, parameters and cases; `scenario` keeps only that scenario's cases. */
export function preparePlan(plan: Plan, scenario?: string): PreparedPlan {
  const settings = resolveSettings(plan);
  if (settings.outputPoints > LIMITS.maxOutputPoints) {
    throw new AnalysisLimitError(
      `settings.outputPoints is ${settings.outputPoints}; the limit is ${LIMITS.maxOutputPoints}`,
    );
  }
  const cases = scenarioCases(plan, settings, scenario);
  if (scenario !== undefined && cases.length === 0) {
    throw new AnalysisLimitError(
      `scenario ${scenario}: not in the plan (known: ${(plan.scenarios ?? []).map((s) => s.id).join(', ') || 'power-up, power-down'})`,
    );
  }
  if (cases.length > LIMITS.maxCases) {
    throw new AnalysisLimitError(
      `plan has ${cases.length} scenario × temperature cases; the limit is ${LIMITS.maxCases}`,
    );
  }
  return { plan, settings, parameters: planParameters(plan, settings.normalK), cases };
}

/** Parameter values at positions x (tolerance) and y (temperature band) at the case's temperature. */
export function valuesAt(
  prep: PreparedPlan,
  c: ScenarioCase,
  x: ArrayLike<number>,
  y: ArrayLike<number>,
): Map<string, number> {
  const values = new Map<string, number>();
  prep.parameters.forEach((p, i) =>
    values.set(p.id, parameterValue(p, x[i] ?? 0, y[i] ?? 0, c.temperature)),
  );
  return values;
}

/** "C4 −20 %, R7 +1 %, 85 °C" for the parameters that moved away from nominal. */
export function cornerLabel(
  prep: PreparedPlan,
  values: ReadonlyMap<string, number>,
  temperature: number,
): string {
  const parts = prep.parameters
    .filter(
      (p) =>
        Math.abs((values.get(p.id) ?? p.nominal) - p.nominal) >
        1e-12 * Math.max(1, Math.abs(p.nominal)),
    )
    .map((p) => describeDeviation(p, values.get(p.id) ?? p.nominal));
  return [...parts, `${temperature} °C`].join(', ');
}

export interface CaseRun {
  sim: SimResult;
  /** Signal waveforms for measurement: the accepted internal steps when the simulator kept them. */
  signals: Map<string, { spec: SignalSpec; wave: SampledWaveform }>;
}

/** A net's waveform on the simulator's internal steps (exact jumps), else on the output grid. */
export function netWave(sim: SimResult, net: string): SampledWaveform | undefined {
  const stepValues = sim.steps?.nets[net];
  if (sim.steps !== undefined && stepValues !== undefined)
    return { time: sim.steps.time, values: stepValues };
  const values = sim.nets[net];
  return values === undefined ? undefined : { time: sim.time, values };
}

/**
 * Simulates a case; errors are rethrown naming the scenario, temperature and corner.
 * @param allNets report every net (nominal runs, closed-form checks); otherwise only signal nets.
 * @param outputPoints evenly spaced output points; default the plan's. Measurements read the
 *   accepted steps (`netWave`), so a caller that only measures may ask for as few as 2.
 * @param toleranceScale per-net tolerance reference from t = 0 (see `SimOptions`), e.g. the
 *   nominal run's `peaks` for the runs of a Monte Carlo.
 */
export function simulateCase(
  prep: PreparedPlan,
  c: ScenarioCase,
  values: ReadonlyMap<string, number>,
  simulate: SimulateFn,
  allNets = false,
  outputPoints = prep.settings.outputPoints,
  toleranceScale?: Readonly<Record<string, number>>,
): CaseRun {
  const netlist = buildNetlist(prep.plan, c, values);
  const probes = allNets ? undefined : [...new Set(prep.plan.signals.map((s) => s.net))];
  let sim: SimResult;
  try {
    sim = simulate(netlist, {
      tStop: c.tStop,
      outputPoints,
      keepSteps: true,
      ...(probes === undefined ? {} : { probes }),
      ...(toleranceScale === undefined ? {} : { toleranceScale }),
    });
  } catch (err) {
    const why = err instanceof Error ? err.message : String(err);
    throw new SimulationFailedError(
      `scenario ${c.scenarioId} at ${c.temperature} °C (${cornerLabel(prep, values, c.temperature)}): ${why}`,
      err,
    );
  }
  const signals = new Map<string, { spec: SignalSpec; wave: SampledWaveform }>();
  for (const spec of prep.plan.signals) {
    const wave = netWave(sim, spec.net);
    if (wave === undefined)
      throw new SimulationFailedError(
        `signal ${spec.id}: simulator returned no waveform for net ${spec.net}`,
      );
    signals.set(spec.id, { spec, wave });
  }
  return { sim, signals };
}

/** Requirements that apply to a case, in plan order. */
export function caseRequirements(prep: PreparedPlan, c: ScenarioCase): RequirementSpec[] {
  return prep.plan.requirements.filter((r) => appliesTo(r, c.kind));
}

/** Measures the case's requirements on a run. */
export function measureCase(
  prep: PreparedPlan,
  c: ScenarioCase,
  run: CaseRun,
): RequirementMeasure[] {
  const ctx = {
    signals: run.signals,
    windowStart: c.windowStart,
    windowEnd: c.tStop,
    settings: prep.settings,
  };
  return caseRequirements(prep, c).map((r) => evaluateRequirement(ctx, r));
}
