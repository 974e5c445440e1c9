/**
 * The solve of one step for a network made only of linear parts (resistors, capacitors,
 * inductors, independent sources). One solve is exact there, so there is no Newton iteration to
 * manage. Step length and integration method enter the matrix only through the coefficient a0
 * of the formula (capacitors stamp C·a0, inductors −L·a0). While a0 stays the same, so does the
 * matrix: it is neither re-assembled nor compared, and only the right-hand side is rebuilt
 * before the triangular solves with the kept LU factors.
 */
import type { MnaSolver } from './mna-solver';
import type { LinearModel, StepContext } from './stamp';

export class LinearStepper {
  /** Coefficient a0 of the matrix held (and factorised) by the solver; NaN: none. */
  private a0 = Number.NaN;

  constructor(
    private readonly models: readonly LinearModel[],
    private readonly solver: MnaSolver,
  ) {}

  /** Forgets the assembled matrix (new values are loaded at the start of every run). */
  reset(): void {
    this.a0 = Number.NaN;
  }

  /**
   * Solves the step described by `ctx` into `out`; `x` is the iterate the stamps are given
   * (linear parts ignore it). Results are bit-identical to a full assembly, because the kept
   * matrix is the one a full assembly would rebuild and the right-hand side is summed in the
   * same order.
   */
  solve(x: Float64Array, out: Float64Array, ctx: StepContext): void {
    const { solver, models } = this;
    const a0 = ctx.method.coefficient(ctx.h);
    if (a0 === this.a0) {
      solver.clearRhs();
      for (const m of models) m.stampRhs(solver, ctx);
      solver.solveFactored(out);
      return;
    }
    // Not valid until the solve has succeeded (it throws on a singular matrix).
    this.a0 = Number.NaN;
    solver.clear();
    for (const m of models) m.stamp(solver, x, ctx);
    solver.solve(out, ctx.t);
    this.a0 = a0;
  }
}
