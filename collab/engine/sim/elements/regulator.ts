import type { Element, SimEvent } from '../../netlist';
import { OPEN_LEAK } from '../math';
import { type BehaviouralModel, type MnaSystem, type StepContext } from '../stamp';
import { type OutputDrive, PowerOnGate } from './power-on-gate';

/** Output regimes, chosen per Newton iterate (a piecewise-linear part). */
const OFF = -1;
const RAMP = 0;
const DROPOUT = 1;
const FLOOR = 2;
const LIMIT = 3;

/** Defaults for the optional power-good fields (documented in the contract). */
export const PG_DEFAULTS = { threshold: 0.9, delay: 0, ron: 50 } as const;

/**
 * Behavioural regulator: when enabled, an ideal target voltage behind `rout`, where the target
 * ramps (soft-start or slew rate) to vout and is capped at v(in) − dropout; optionally a
 * current limit. The input draws no current (an ideal block; model input loading with a
 * resistor). Power-good is open-drain and is also asserted while the regulator is disabled.
 */
export class RegulatorModel implements BehaviouralModel {
  readonly nonlinear = false;
  readonly watchCount = 5;
  readonly nodes: readonly number[];
  private p = {
    vout: 0,
    enOn: 0,
    enOff: 0,
    uvlo: 0,
    softStart: 0,
    slewRate: 0,
    dropout: 0,
    gout: 1,
    gdis: 0,
    ilimit: Infinity,
    pgLevel: 0,
    pgDelay: 0,
    gpg: 1,
  };
  private readonly gate = new PowerOnGate();
  private enHigh = false;
  private uvloOk = false;
  private enabled = false;
  private rampT0 = 0;
  private rampV0 = 0;
  private rampSlope = 0;
  private rampEnd = 0;
  private rampPending = false;
  private mode = OFF;
  private stampT = 0;
  private pgGood = false;
  private pgReleased = false;
  private pgPendingAt = Infinity;
  private pgDrive: OutputDrive = 'normal';
  private pgLogged: '' | 'low' | 'high' = '';

  /** @param pg Power-good unknown; pass `hasPg = false` when the part has none. */
  constructor(
    readonly id: string,
    private readonly input: number,
    private readonly en: number,
    private readonly out: number,
    private readonly gnd: number,
    private readonly pg: number,
    private readonly hasPg: boolean,
  ) {
    this.nodes = hasPg ? [input, en, out, gnd, pg] : [input, en, out, gnd];
  }

  load(el: Element): void {
    if (el.kind !== 'regulator') return;
    this.p = {
      vout: el.vout,
      enOn: el.enOn,
      enOff: el.enOff,
      uvlo: el.uvlo,
      softStart: el.softStart,
      slewRate: el.slewRate ?? 0,
      dropout: el.dropout,
      gout: 1 / el.rout,
      gdis: el.rdischarge !== undefined ? 1 / el.rdischarge : 0,
      ilimit: el.ilimit ?? Infinity,
      pgLevel: (el.pgThreshold ?? PG_DEFAULTS.threshold) * el.vout,
      pgDelay: el.pgDelay ?? PG_DEFAULTS.delay,
      gpg: 1 / (el.pgRon ?? PG_DEFAULTS.ron),
    };
    this.gate.configure(el.vmin ?? 0, el.pgPowerOn ?? { kind: 'hiz' });
  }

  reset(): void {
    this.enHigh = false;
    this.uvloOk = false;
    this.enabled = false;
    this.rampPending = false;
    this.mode = OFF;
    this.pgGood = false;
    this.pgReleased = false;
    this.pgPendingAt = Infinity;
    this.pgDrive = 'normal';
    this.pgLogged = '';
    this.gate.reset();
  }

  private target(t: number): number {
    return t >= this.rampEnd ? this.p.vout : this.rampV0 + this.rampSlope * (t - this.rampT0);
  }

  /** Output regime at iterate x and time t. */
  private regime(x: Float64Array, t: number): number {
    if (!this.enabled) return OFF;
    const vg = x[this.gnd];
    const avail = x[this.input] - vg - this.p.dropout;
    const tgt = this.target(t);
    const mode = tgt <= avail ? RAMP : avail > 0 ? DROPOUT : FLOOR;
    if (this.p.ilimit === Infinity) return mode;
    const v = mode === RAMP ? tgt : mode === DROPOUT ? avail : 0;
    return (v - (x[this.out] - vg)) * this.p.gout > this.p.ilimit ? LIMIT : mode;
  }

  stamp(s: MnaSystem, x: Float64Array, c: StepContext): void {
    const { out, gnd } = this;
    const g = this.p.gout;
    this.stampT = c.t;
    this.mode = this.regime(x, c.t);
    s.addConductance(out, gnd, OPEN_LEAK);
    if (this.mode === OFF) {
      if (this.p.gdis > 0) s.addConductance(out, gnd, this.p.gdis);
    } else if (this.mode === RAMP || this.mode === FLOOR) {
      s.addConductance(out, gnd, g);
      if (this.mode === RAMP) s.addCurrent(gnd, out, this.target(c.t) * g);
    } else if (this.mode === DROPOUT) {
      // Current g·(v(in) − v(out) − dropout) from gnd into out (a VCCS; no input current).
      s.addEntry(out, out, g);
      s.addEntry(out, this.input, -g);
      s.addEntry(gnd, out, -g);
      s.addEntry(gnd, this.input, g);
      s.addCurrent(gnd, out, -this.p.dropout * g);
    } else {
      s.addCurrent(gnd, out, this.p.ilimit);
    }
    if (this.hasPg) {
      s.addConductance(this.pg, gnd, OPEN_LEAK);
      if (this.pgDrive === 'low') s.addConductance(this.pg, gnd, this.p.gpg);
    }
  }

  settled(x: Float64Array): boolean {
    return this.regime(x, this.stampT) === this.mode;
  }

  accept(): void {}

  watch(k: number, x: Float64Array): number {
    const vg = x[this.gnd];
    const vin = x[this.input] - vg;
    const p = this.p;
    if (k === 0) {
      const ven = x[this.en] - vg;
      return this.enHigh ? p.enOff - ven : ven - p.enOn;
    }
    if (k === 1) return this.uvloOk ? p.uvlo - vin : vin - p.uvlo;
    if (!this.hasPg) return -1;
    if (k === 2) {
      if (!this.enabled && !this.pgGood) return -1;
      const vo = x[this.out] - vg;
      return this.pgGood ? p.pgLevel - vo : vo - p.pgLevel;
    }
    return this.gate.watch(k - 3, vin);
  }

  update(t: number, x: Float64Array, events: SimEvent[]): boolean {
    const p = this.p;
    const vg = x[this.gnd];
    const vin = x[this.input] - vg;
    const ven = x[this.en] - vg;
    const vo = x[this.out] - vg;
    if (!this.enHigh && ven > p.enOn) this.enHigh = true;
    else if (this.enHigh && ven < p.enOff) this.enHigh = false;
    this.uvloOk = vin > p.uvlo;
    let changed = false;
    const enabled = this.enHigh && this.uvloOk;
    if (enabled !== this.enabled) {
      this.enabled = enabled;
      changed = true;
      if (enabled) this.startRamp(t, vo);
      else this.rampPending = false;
      events.push({
        t,
        element: this.id,
        what: enabled ? 'regulator-enabled' : 'regulator-disabled',
      });
    }
    if (this.rampPending && t >= this.rampEnd) {
      this.rampPending = false;
      events.push({ t: this.rampEnd, element: this.id, what: 'soft-start-done' });
    }
    if (this.hasPg && this.updatePg(t, vin, vo, events)) changed = true;
    return changed;
  }

  private startRamp(t: number, vo: number): void {
    const p = this.p;
    const v0 = Math.min(Math.max(vo, 0), p.vout);
    const duration = p.slewRate > 0 ? (p.vout - v0) / p.slewRate : p.softStart;
    this.rampT0 = t;
    this.rampV0 = v0;
    this.rampEnd = t + duration;
    this.rampSlope = duration > 0 ? (p.vout - v0) / duration : 0;
    this.rampPending = duration > 0;
  }

  private updatePg(t: number, vin: number, vo: number, events: SimEvent[]): boolean {
    const good = this.enabled && vo > this.p.pgLevel;
    if (good && !this.pgGood) {
      this.pgGood = true;
      if (this.p.pgDelay === 0) this.pgReleased = true;
      else this.pgPendingAt = t + this.p.pgDelay;
    } else if (!good && this.pgGood) {
      this.pgGood = false;
      this.pgPendingAt = Infinity;
      this.pgReleased = false;
    }
    if (this.pgPendingAt <= t) {
      this.pgReleased = true;
      this.pgPendingAt = Infinity;
    }
    this.gate.update(t, vin, this.id, events);
    const g = this.gate.current();
    const drive: OutputDrive = g === 'normal' ? (this.pgReleased ? 'hiz' : 'low') : g;
    const resolved = drive === 'high' ? 'hiz' : drive;
    if (resolved === this.pgDrive) return false;
    this.pgDrive = resolved;
    const logical = resolved === 'low' ? 'low' : 'high';
    if (logical !== this.pgLogged) {
      this.pgLogged = logical;
      events.push({ t, element: this.id, what: logical === 'low' ? 'pg-asserted' : 'pg-released' });
    }
    return true;
  }

  nextDue(): number {
    const ramp = this.rampPending ? this.rampEnd : Infinity;
    return Math.min(ramp, this.pgPendingAt, this.gate.nextDue());
  }
}
