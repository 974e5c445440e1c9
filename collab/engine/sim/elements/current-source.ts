import type { Element, SourceWaveform } from '../../netlist';
import { type LinearModel, type MnaSystem, type SourceModel, type StepContext } from '../stamp';
import { collectCorners, jumpsAt, sourceValue } from '../waveform';

/** Independent current source pushing its value from `from` into `to`. */
export class CurrentSourceModel implements SourceModel, LinearModel {
  readonly nonlinear = false;
  readonly nodes: readonly number[];
  private wave: SourceWaveform = { kind: 'dc', value: 0 };

  constructor(
    readonly id: string,
    private readonly from: number,
    private readonly to: number,
  ) {
    this.nodes = [from, to];
  }

  load(el: Element): void {
    if (el.kind === 'isource') this.wave = el.wave;
  }

  reset(): void {}

  stamp(s: MnaSystem, _x: Float64Array, ctx: StepContext): void {
    s.addCurrent(this.from, this.to, sourceValue(this.wave, ctx.t, ctx.left));
  }

  stampRhs(s: MnaSystem, ctx: StepContext): void {
    s.addCurrent(this.from, this.to, sourceValue(this.wave, ctx.t, ctx.left));
  }

  settled(): boolean {
    return true;
  }

  accept(): void {}

  corners(out: number[]): void {
    collectCorners(this.wave, out);
  }

  jumpsAt(t: number): boolean {
    return jumpsAt(this.wave, t);
  }
}
