import type { Element } from '../../netlist';
import { type LinearModel, type MnaSystem } from '../stamp';

/** Linear resistor: a conductance 1/R between its nets. */
export class ResistorModel implements LinearModel {
  readonly nonlinear = false;
  readonly nodes: readonly number[];
  private g = 0;

  constructor(
    readonly id: string,
    private readonly a: number,
    private readonly b: number,
  ) {
    this.nodes = [a, b];
  }

  load(el: Element): void {
    if (el.kind === 'resistor') this.g = 1 / el.ohms;
  }

  reset(): void {}

  stamp(s: MnaSystem): void {
    s.addConductance(this.a, this.b, this.g);
  }

  /** A resistor has no right-hand-side term. */
  stampRhs(): void {}

  settled(): boolean {
    return true;
  }

  accept(): void {}
}
