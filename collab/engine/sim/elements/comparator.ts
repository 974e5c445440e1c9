import type { Element, SimEvent } from '../../netlist';
import { OPEN_LEAK } from '../math';
import { type BehaviouralModel, type MnaSystem } from '../stamp';
import { type OutputDrive, PowerOnGate } from './power-on-gate';

/**
 * Comparator / switch with hysteresis and an inertial propagation delay: the output follows the
 * input decision `delay` seconds later, and a decision that flips back before then is dropped.
 * The output is a resistance `rout` to the supply (high, push-pull only) or to gnd (low).
 */
export class ComparatorModel implements BehaviouralModel {
  readonly nonlinear = false;
  readonly watchCount = 3;
  readonly nodes: readonly number[];
  private threshold = 0;
  private halfHyst = 0;
  private delay = 0;
  private openDrain = false;
  private gout = 1;
  private readonly gate = new PowerOnGate();
  private initialised = false;
  private decision = false;
  private output = false;
  private pendingAt = Infinity;
  /** Resolved drive; 'normal' only before the first update. */
  private drive: OutputDrive = 'normal';
  private level: '' | 'low' | 'high' = '';

  constructor(
    readonly id: string,
    private readonly inP: number,
    private readonly inN: number,
    private readonly supply: number,
    private readonly gnd: number,
    private readonly out: number,
  ) {
    this.nodes = [inP, inN, supply, gnd, out];
  }

  load(el: Element): void {
    if (el.kind !== 'comparator') return;
    this.threshold = el.threshold;
    this.halfHyst = el.hysteresis / 2;
    this.delay = el.delay;
    this.openDrain = el.output === 'open-drain';
    this.gout = 1 / el.rout;
    this.gate.configure(el.vmin, el.powerOn);
  }

  reset(): void {
    this.initialised = false;
    this.pendingAt = Infinity;
    this.gate.reset();
    this.drive = 'normal';
    this.level = '';
  }

  private diff(x: Float64Array): number {
    return x[this.inP] - x[this.inN];
  }

  private supplyVoltage(x: Float64Array): number {
    return x[this.supply] - x[this.gnd];
  }

  stamp(s: MnaSystem): void {
    s.addConductance(this.out, this.gnd, OPEN_LEAK);
    if (this.drive === 'low') s.addConductance(this.out, this.gnd, this.gout);
    else if (this.drive === 'high') s.addConductance(this.out, this.supply, this.gout);
  }

  settled(): boolean {
    return true;
  }

  accept(): void {}

  watch(k: number, x: Float64Array): number {
    if (k > 0) return this.gate.watch(k - 1, this.supplyVoltage(x));
    const d = this.diff(x);
    return this.decision ? this.threshold - this.halfHyst - d : d - this.threshold - this.halfHyst;
  }

  update(t: number, x: Float64Array, events: SimEvent[]): boolean {
    const d = this.diff(x);
    if (!this.initialised) {
      // Power-up state: decided on the bare threshold, no delay (nothing precedes t = 0).
      this.initialised = true;
      this.decision = d > this.threshold;
      this.output = this.decision;
    } else {
      this.decide(t, d);
    }
    if (this.pendingAt <= t) {
      this.output = this.decision;
      this.pendingAt = Infinity;
    }
    this.gate.update(t, this.supplyVoltage(x), this.id, events);
    return this.applyDrive(t, events);
  }

  private decide(t: number, d: number): void {
    const before = this.decision;
    if (!before && d > this.threshold + this.halfHyst) this.decision = true;
    else if (before && d < this.threshold - this.halfHyst) this.decision = false;
    if (this.decision === before) return;
    if (this.delay === 0) this.output = this.decision;
    else if (this.decision !== this.output) this.pendingAt = t + this.delay;
    else this.pendingAt = Infinity;
  }

  private applyDrive(t: number, events: SimEvent[]): boolean {
    const g = this.gate.current();
    let next: OutputDrive = g === 'normal' ? (this.output ? 'high' : 'low') : g;
    if (this.openDrain && next === 'high') next = 'hiz';
    if (next === this.drive) return false;
    this.drive = next;
    // Logged by logical level (an open output reads high); the first entry is the t = 0 state.
    const logical = next === 'low' ? 'low' : 'high';
    if (logical !== this.level) {
      this.level = logical;
      events.push({ t, element: this.id, what: `comparator-${logical}` });
    }
    return true;
  }

  nextDue(): number {
    return Math.min(this.pendingAt, this.gate.nextDue());
  }
}
