/**
 * Named errors of the transient simulator. They are thrown only for an invalid setup or a
 * circuit the method cannot solve; every message names the part or net concerned.
 */

/** What a `NetlistError` points at. */
export interface NetlistErrorTarget {
  /** Id of the offending element, when one is to blame. */
  element?: string;
  /** Name of the offending net, when one is to blame. */
  net?: string;
  /** Offending field of the element, e.g. `'ohms'`. */
  field?: string;
}

/** The netlist or the options are invalid (bad value, floating net, source loop, size...). */
export class NetlistError extends Error {
  override readonly name = 'NetlistError';
  readonly element?: string;
  readonly net?: string;
  readonly field?: string;

  constructor(message: string, target: NetlistErrorTarget = {}) {
    super(message);
    this.element = target.element;
    this.net = target.net;
    this.field = target.field;
  }
}

/** The circuit matrix has no unique solution (e.g. a node only reached through a current source). */
export class SingularMatrixError extends Error {
  override readonly name = 'SingularMatrixError';

  /** @param nets Nets (or `current of <part>`) whose equations are dependent. */
  constructor(
    readonly nets: string[],
    readonly time: number,
  ) {
    super(`singular circuit matrix at t = ${time} s: no unique solution for ${nets.join(', ')}`);
  }
}

/** Newton–Raphson did not converge even at the smallest allowed step. */
export class ConvergenceError extends Error {
  override readonly name = 'ConvergenceError';

  /** @param parts Ids of the nonlinear parts that had not settled. */
  constructor(
    readonly time: number,
    readonly parts: string[],
  ) {
    super(
      `Newton iteration did not converge at t = ${time} s` +
        (parts.length > 0 ? ` (parts not settled: ${parts.join(', ')})` : ''),
    );
  }
}

/**
 * The local truncation error forced the step below the minimum step, or the run used up its
 * step budget (`reason: 'step budget'`).
 */
export class TimestepUnderflowError extends Error {
  override readonly name = 'TimestepUnderflowError';

  /** @param parts Ids of the parts attached to the net with the largest error. */
  constructor(
    readonly time: number,
    readonly step: number,
    readonly parts: string[],
    readonly reason: 'minimum step' | 'step budget' = 'minimum step',
  ) {
    super(
      (reason === 'minimum step'
        ? `time step ${step} s fell below the minimum at t = ${time} s`
        : `step budget exhausted at t = ${time} s (step ${step} s)`) +
        (parts.length > 0 ? ` (near parts: ${parts.join(', ')})` : ''),
    );
  }
}
