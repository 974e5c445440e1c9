import type { Element } from '../../netlist';
import { type ElementModel, type MnaSystem } from '../stamp';

/** Linear resistor: a conductance 1/R between its nets. */
export class ResistorModel implements ElementModel {
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

  settled(): boolean {
    return true;
  }

  accept(): void {}
}
