/** Named errors for invalid setup. Messages always name the net, part or field at fault. */

/** The plan is malformed or inconsistent (unknown net, bad value, floating net…). */
export class PlanError extends Error {
  /** Every problem found, one line each; `message` joins them. */
  readonly problems: readonly string[];

  constructor(problems: readonly string[]) {
    super(
      problems.length === 1
        ? problems[0]
        : `${problems.length} problems in plan:\n- ${problems.join('\n- ')}`,
    );
    this.name = 'PlanError';
    this.problems = problems;
  }
}

/** The requested analysis exceeds a stated limit or has bad options. */
export class AnalysisLimitError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'AnalysisLimitError';
  }
}

/** A simulation failed; the message carries the scenario, temperature and corner. */
export class SimulationFailedError extends Error {
  constructor(message: string, cause?: unknown) {
    super(message, { cause });
    this.name = 'SimulationFailedError';
  }
}
