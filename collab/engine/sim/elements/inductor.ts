import type { Element } from '../../netlist';
import { type LinearModel, type MnaSystem, type StepContext } from '../stamp';

/**
 * Inductor with its current as an unknown (so it is a short at DC and may sit in series with an
 * ideal source): v(a) − v(b) = L·(a0·i − history).
 */
export class InductorModel implements LinearModel {
  readonly nonlinear = false;
  readonly nodes: readonly number[];
  private l = 0;
  private i0 = 0;
  private i = 0;
  private v = 0;

  constructor(
    readonly id: string,
    private readonly a: number,
    private readonly b: number,
    private readonly k: number,
  ) {
    this.nodes = [a, b, k];
  }

  load(el: Element): void {
    if (el.kind !== 'inductor') return;
    this.l = el.henries;
    this.i0 = el.i0 ?? 0;
  }

  reset(): void {
    this.i = this.i0;
    this.v = 0;
  }

  stamp(s: MnaSystem, _x: Float64Array, ctx: StepContext): void {
    const { a, b, k } = this;
    s.addEntry(a, k, 1);
    s.addEntry(b, k, -1);
    s.addEntry(k, a, 1);
    s.addEntry(k, b, -1);
    s.addEntry(k, k, -this.l * ctx.method.coefficient(ctx.h));
    s.rhs[k] -= this.l * ctx.method.history(ctx.h, this.i, this.v / this.l);
  }

  stampRhs(s: MnaSystem, ctx: StepContext): void {
    s.rhs[this.k] -= this.l * ctx.method.history(ctx.h, this.i, this.v / this.l);
  }

  settled(): boolean {
    return true;
  }

  accept(x: Float64Array): void {
    this.i = x[this.k];
    this.v = x[this.a] - x[this.b];
  }
}
