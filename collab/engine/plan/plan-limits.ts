/**
 * Size limits of a plan and of an analysis. They keep a shared browser tab or a server worker
 * responsive; every error that trips one states the limit in its message.
 */
export const LIMITS = {
  /** Parts in one plan. */
  maxParts: 400,
  /** Nets in one plan. */
  maxNets: 400,
  /** Output points of one transient run. */
  maxOutputPoints: 100_000,
  /** Monte Carlo runs of one analysis. */
  maxMonteCarloRuns: 100_000,
  /** Varying parameters enumerated exhaustively (2^n corners); beyond it corners are guided. */
  maxExhaustiveParameters: 12,
  /** Scenario × temperature cases of one plan. */
  maxCases: 64,
  /** Histogram bins of a Monte Carlo summary. */
  maxHistogramBins: 200,
} as const;

/** Plan schema version understood by this engine. */
export const PLAN_SCHEMA_VERSION = 1;
