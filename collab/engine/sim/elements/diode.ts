import type { Element } from '../../netlist';
import { GMIN, limitedExp, limitedExpSlope } from '../math';
import { type ElementModel, type MnaSystem } from '../stamp';

/**
 * Junction voltage limiting between Newton iterations, after the classic SPICE3 `pnjlim`
 * (Nagel, "SPICE2: A computer program to simulate semiconductor circuits", 1975; algorithm
 * recalled from memory): above the critical voltage a large forward jump is replaced by a
 * logarithmic one, so exp() cannot overflow and the iteration does not overshoot.
 */
export function limitJunction(vNew: number, vOld: number, nvt: number, vcrit: number): number {
  if (vNew > vcrit && Math.abs(vNew - vOld) > 2 * nvt) {
    if (vOld > 0) {
      const arg = 1 + (vNew - vOld) / nvt;
      return arg > 0 ? vOld + nvt * Math.log(arg) : vcrit;
    }
    return nvt * Math.log(vNew / nvt);
  }
  return vNew;
}

/**
 * Diode: Shockley exponential with junction limiting, or a piecewise-linear drop (off below
 * vf, then ron). A GMIN leak in parallel keeps a reverse-biased diode from floating its nets.
 */
export class DiodeModel implements ElementModel {
  nonlinear = true;
  readonly nodes: readonly number[];
  private shockley = true;
  private is = 1e-14;
  private nvt = 0.025;
  private vcrit = 0.6;
  private vf = 0.7;
  private gon = 1;
  /** Junction voltage the last stamp was linearised at. */
  private vd = 0;
  private limited = false;
  private on = false;

  constructor(
    readonly id: string,
    private readonly anode: number,
    private readonly cathode: number,
  ) {
    this.nodes = [anode, cathode];
  }

  load(el: Element, vt: number): void {
    if (el.kind !== 'diode') return;
    const m = el.model;
    this.shockley = m.kind === 'shockley';
    this.nonlinear = this.shockley;
    if (m.kind === 'shockley') {
      this.is = m.is;
      this.nvt = m.n * vt;
      this.vcrit = this.nvt * Math.log(this.nvt / (Math.SQRT2 * this.is));
    } else {
      this.vf = m.vf;
      this.gon = 1 / m.ron;
    }
  }

  reset(): void {
    this.vd = 0;
    this.on = false;
  }

  stamp(s: MnaSystem, x: Float64Array): void {
    const v = x[this.anode] - x[this.cathode];
    if (this.shockley) {
      const vl = limitJunction(v, this.vd, this.nvt, this.vcrit);
      this.limited = vl !== v;
      this.vd = vl;
      const u = vl / this.nvt;
      const id = this.is * (limitedExp(u) - 1);
      const gd = (this.is / this.nvt) * limitedExpSlope(u);
      s.addConductance(this.anode, this.cathode, gd + GMIN);
      s.addCurrent(this.anode, this.cathode, id - gd * vl);
      return;
    }
    const on = v > this.vf;
    this.on = on;
    s.addConductance(this.anode, this.cathode, (on ? this.gon : 0) + GMIN);
    if (on) s.addCurrent(this.anode, this.cathode, -this.vf * this.gon);
  }

  settled(x: Float64Array): boolean {
    if (this.shockley) return !this.limited;
    return x[this.anode] - x[this.cathode] > this.vf === this.on;
  }

  accept(): void {}
}
