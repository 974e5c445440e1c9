import type { Element } from '../../netlist';
import { type LinearModel, type MnaSystem, type StepContext } from '../stamp';

/**
 * Capacitor companion model: i(t+h) = geq·v(t+h) − ieq with geq = C·a0 and
 * ieq = C·history, from the integration method in use.
 */
export class CapacitorModel implements LinearModel {
  readonly nonlinear = false;
  readonly nodes: readonly number[];
  private c = 0;
  private v0 = 0;
  /** Accepted voltage and current at the start of the step. */
  private v = 0;
  private i = 0;
  private geq = 0;
  private ieq = 0;

  constructor(
    readonly id: string,
    private readonly a: number,
    private readonly b: number,
  ) {
    this.nodes = [a, b];
  }

  load(el: Element): void {
    if (el.kind !== 'capacitor') return;
    this.c = el.farads;
    this.v0 = el.v0 ?? 0;
  }

  reset(): void {
    this.v = this.v0;
    this.i = 0;
  }

  stamp(s: MnaSystem, _x: Float64Array, ctx: StepContext): void {
    this.geq = this.c * ctx.method.coefficient(ctx.h);
    this.ieq = this.c * ctx.method.history(ctx.h, this.v, this.i / this.c);
    s.addConductance(this.a, this.b, this.geq);
    s.addCurrent(this.b, this.a, this.ieq);
  }

  stampRhs(s: MnaSystem, ctx: StepContext): void {
    this.geq = this.c * ctx.method.coefficient(ctx.h);
    this.ieq = this.c * ctx.method.history(ctx.h, this.v, this.i / this.c);
    s.addCurrent(this.b, this.a, this.ieq);
  }

  settled(): boolean {
    return true;
  }

  accept(x: Float64Array): void {
    this.v = x[this.a] - x[this.b];
    this.i = this.geq * this.v - this.ieq;
  }
}
