import type { Element, SimEvent } from '../../netlist';
import { OPEN_LEAK } from '../math';
import { type BehaviouralModel, type MnaSystem } from '../stamp';
import { type OutputDrive, PowerOnGate } from './power-on-gate';

/**
 * Reset supervisor: open-drain, active-low output released once every monitored net has stayed
 * above its threshold for `timeout`; asserted `delay` after any falls below threshold −
 * hysteresis (a pending assertion always fires; the timeout then restarts).
 */
export class SupervisorModel implements BehaviouralModel {
  readonly nonlinear = false;
  readonly watchCount: number;
  readonly nodes: readonly number[];
  private readonly thresholds: Float64Array;
  private readonly lows: Float64Array;
  private readonly ok: Uint8Array;
  private timeout = 0;
  private delay = 0;
  private gout = 1;
  private readonly gate = new PowerOnGate();
  private allOk = false;
  private released = false;
  private releaseAt = Infinity;
  private assertAt = Infinity;
  private drive: OutputDrive = 'normal';
  private logged: '' | 'low' | 'high' = '';

  constructor(
    readonly id: string,
    private readonly supply: number,
    private readonly gnd: number,
    private readonly out: number,
    private readonly monitors: Int32Array,
  ) {
    this.nodes = [supply, gnd, out, ...monitors];
    const n = monitors.length;
    this.watchCount = n + 2;
    this.thresholds = new Float64Array(n);
    this.lows = new Float64Array(n);
    this.ok = new Uint8Array(n);
  }

  load(el: Element): void {
    if (el.kind !== 'supervisor') return;
    el.monitors.forEach((m, i) => {
      this.thresholds[i] = m.threshold;
      this.lows[i] = m.threshold - m.hysteresis;
    });
    this.timeout = el.timeout;
    this.delay = el.delay;
    this.gout = 1 / el.rout;
    this.gate.configure(el.vmin, el.powerOn);
  }

  reset(): void {
    this.ok.fill(0);
    this.allOk = false;
    this.released = false;
    this.releaseAt = Infinity;
    this.assertAt = Infinity;
    this.drive = 'normal';
    this.logged = '';
    this.gate.reset();
  }

  private level(x: Float64Array, i: number): number {
    return x[this.monitors[i]] - x[this.gnd];
  }

  stamp(s: MnaSystem): void {
    s.addConductance(this.out, this.gnd, OPEN_LEAK);
    if (this.drive === 'low') s.addConductance(this.out, this.gnd, this.gout);
  }

  settled(): boolean {
    return true;
  }

  accept(): void {}

  watch(k: number, x: Float64Array): number {
    const n = this.monitors.length;
    if (k >= n) return this.gate.watch(k - n, x[this.supply] - x[this.gnd]);
    const v = this.level(x, k);
    return this.ok[k] ? this.lows[k] - v : v - this.thresholds[k];
  }

  update(t: number, x: Float64Array, events: SimEvent[]): boolean {
    let all = true;
    for (let i = 0; i < this.monitors.length; i++) {
      const v = this.level(x, i);
      if (!this.ok[i] && v > this.thresholds[i]) this.ok[i] = 1;
      else if (this.ok[i] && v < this.lows[i]) this.ok[i] = 0;
      if (!this.ok[i]) all = false;
    }
    if (all && !this.allOk && !this.released) this.releaseAt = t + this.timeout;
    if (!all && this.allOk) {
      this.releaseAt = Infinity;
      if (this.released) this.assertAt = t + this.delay;
    }
    this.allOk = all;
    if (this.releaseAt <= t) {
      this.released = true;
      this.releaseAt = Infinity;
    }
    if (this.assertAt <= t) {
      this.released = false;
      this.assertAt = Infinity;
      if (this.allOk) this.releaseAt = t + this.timeout;
    }
    this.gate.update(t, x[this.supply] - x[this.gnd], this.id, events);
    return this.applyDrive(t, events);
  }

  private applyDrive(t: number, events: SimEvent[]): boolean {
    const g = this.gate.current();
    const wanted: OutputDrive = g === 'normal' ? (this.released ? 'hiz' : 'low') : g;
    const next = wanted === 'high' ? 'hiz' : wanted;
    if (next === this.drive) return false;
    this.drive = next;
    const logical = next === 'low' ? 'low' : 'high';
    if (logical !== this.logged) {
      this.logged = logical;
      events.push({
        t,
        element: this.id,
        what: logical === 'low' ? 'reset-asserted' : 'reset-released',
      });
    }
    return true;
  }

  nextDue(): number {
    return Math.min(this.releaseAt, this.assertAt, this.gate.nextDue());
  }
}
