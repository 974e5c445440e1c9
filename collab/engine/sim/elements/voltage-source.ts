import type { Element, SourceWaveform } from '../../netlist';
import { type LinearModel, type MnaSystem, type SourceModel, type StepContext } from '../stamp';
import { collectCorners, jumpsAt, sourceValue } from '../waveform';

/**
 * Independent voltage source. Ideal (rs = 0): a branch-current unknown k; with series
 * resistance: its Norton equivalent, which keeps the matrix smaller.
 */
export class VoltageSourceModel implements SourceModel, LinearModel {
  readonly nonlinear = false;
  readonly nodes: readonly number[];
  private wave: SourceWaveform = { kind: 'dc', value: 0 };
  private gs = 0;

  /** @param k Branch unknown, or -1 when the source has series resistance. */
  constructor(
    readonly id: string,
    private readonly pos: number,
    private readonly neg: number,
    private readonly k: number,
  ) {
    this.nodes = k >= 0 ? [pos, neg, k] : [pos, neg];
  }

  load(el: Element): void {
    if (el.kind !== 'vsource') return;
    this.wave = el.wave;
    this.gs = el.rs !== undefined && el.rs > 0 ? 1 / el.rs : 0;
  }

  reset(): void {}

  stamp(s: MnaSystem, _x: Float64Array, ctx: StepContext): void {
    const v = sourceValue(this.wave, ctx.t, ctx.left);
    const { pos, neg, k } = this;
    if (k < 0) {
      s.addConductance(pos, neg, this.gs);
      s.addCurrent(neg, pos, v * this.gs);
      return;
    }
    s.addEntry(pos, k, 1);
    s.addEntry(neg, k, -1);
    s.addEntry(k, pos, 1);
    s.addEntry(k, neg, -1);
    s.rhs[k] += v;
  }

  stampRhs(s: MnaSystem, ctx: StepContext): void {
    const v = sourceValue(this.wave, ctx.t, ctx.left);
    if (this.k < 0) s.addCurrent(this.neg, this.pos, v * this.gs);
    else s.rhs[this.k] += v;
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
