/**
 * The analysis result format: plain JSON a timing canvas or a report can draw from without
 * recomputing. Times in seconds, levels in volts, margins in the requirement's unit.
 */
import type { Edge } from './waveform-ops';

/** A located threshold crossing, for markers. */
export interface CrossingPoint {
  signal: string;
  level: number;
  edge: Edge;
  time: number;
  /** Threshold name when the level came from the signal's named thresholds. */
  threshold?: string;
}

/** One requirement measured on one run. */
export interface RequirementMeasure {
  requirementId: string;
  kind: string;
  unit: 's' | 'V' | 'V/s';
  /** What was measured (e.g. the delay); null when a crossing was never reached. */
  measured: number | null;
  /** The limit it is compared against. */
  limit: number | null;
  /** Distance to the limit in `unit`; ≥ 0 passes. */
  margin: number | null;
  /** margin / scale; compared with the target margin. */
  relativeMargin: number | null;
  /** The quantity the relative margin is relative to (documented per kind). */
  scale: number | null;
  pass: boolean;
  meetsTarget: boolean;
  targetMargin: number;
  /** The crossing points it relates (and the time of the worst point for window checks). */
  points: CrossingPoint[];
  /** Why a measurement is missing or how it was taken. */
  note?: string;
}

/** A worst-case finding for one requirement over every case and corner. */
export interface WorstCaseEntry {
  requirementId: string;
  nominal: RequirementMeasure | null;
  worst: RequirementMeasure | null;
  scenarioId: string | null;
  temperature: number | null;
  /** Parameter id → value at the worst corner. */
  corner: Record<string, number>;
  /** "C4 −20 %, R7 +1 %, 85 °C". */
  cornerLabel: string;
  /** Root-sum-square estimate: nominal margin less the RSS of one-at-a-time margin losses. */
  rssMargin: number | null;
  /** How the corners were chosen. */
  method: 'exhaustive' | 'sensitivity';
  cornersEvaluated: number;
}

/** Streaming summary of one measured quantity. */
export interface StatisticsSummary {
  count: number;
  mean: number;
  sigma: number;
  min: number;
  max: number;
  /** Exact order-statistic percentiles (linear interpolation between ranks). */
  percentiles: Record<string, number>;
  histogram: { edges: number[]; counts: number[] };
}

export interface MonteCarloRequirementSummary {
  requirementId: string;
  scenarioId: string;
  temperature: number;
  margin: StatisticsSummary | null;
  /** Runs where the margin could not be measured (crossing not reached). */
  unmeasured: number;
  /** Fraction of runs that pass / meet the target margin. */
  yieldPass: number;
  yieldTarget: number;
}

export interface MonteCarloSummary {
  runs: number;
  seed: number;
  cancelled: boolean;
  requirements: MonteCarloRequirementSummary[];
}

/** Curves of one signal in one case: nominal plus envelopes. */
export interface SignalCurves {
  signal: string;
  nominal: number[];
  /** min/max over corners, when corners were run. */
  cornerMin?: number[];
  cornerMax?: number[];
  /** 5th/95th percentile curves over the first Monte Carlo runs (default 64), when requested. */
  p05?: number[];
  p95?: number[];
}

/** A closed-form value next to the simulated one. */
export interface ClosedFormCheck {
  id: string;
  description: string;
  scenarioId: string;
  temperature: number;
  closedForm: number;
  simulated: number | null;
  difference: number | null;
  relativeDifference: number | null;
  unit: 's' | 'V';
  note?: string;
}

export interface CaseResult {
  scenarioId: string;
  kind: string;
  temperature: number;
  time: number[];
  curves: SignalCurves[];
  crossings: CrossingPoint[];
  requirements: RequirementMeasure[];
}

export interface AnalysisResult {
  plan: string;
  schemaVersion: number;
  targetMargin: number;
  cases: CaseResult[];
  closedForm: ClosedFormCheck[];
  worstCase?: WorstCaseEntry[];
  monteCarlo?: MonteCarloSummary;
}
