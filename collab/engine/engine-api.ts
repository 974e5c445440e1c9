/**
 * Public entry points of the sequencing engine, for the server, the client's Web Worker and the
 * CLI. Import from here rather than from individual files when only the API is needed.
 */
export { parsePlan } from './plan/validate-plan';
export { PlanError, AnalysisLimitError, SimulationFailedError } from './plan/plan-errors';
export { LIMITS, PLAN_SCHEMA_VERSION } from './plan/plan-limits';
export type { Plan, RequirementSpec, ScenarioSpec, SignalSpec } from './plan/plan-schema';
export type { PartSpec } from './plan/plan-schema-parts';
export { analyzePlan, type AnalyzeOptions } from './analysis/analyze-plan';
export { createEngineSimulator } from './analysis/engine-simulator';
export { preparePlan, type PreparedPlan, type SimulateFn } from './analysis/plan-runner';
export { planMonteCarloChunk, summarizePlanMonteCarlo } from './analysis/plan-monte-carlo';
export { mergeChunks, type MonteCarloChunk } from './analysis/monte-carlo';
export { evaluateRequirement, type EvaluationContext } from './analysis/requirement-eval';
export { suggestValues, type ValueSuggestion } from './analysis/value-suggestion';
export { eSeriesValues, type ESeriesName } from './models/e-series';
export type * from './analysis/result-types';
