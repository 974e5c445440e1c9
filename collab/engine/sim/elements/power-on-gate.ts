import type { PowerOnBehaviour, SimEvent } from '../../netlist';

/** How a behavioural output is driven. `normal` = the part's own logic decides. */
export type OutputDrive = 'normal' | 'low' | 'high' | 'hiz';

/**
 * What an output does while the part's supply is below its minimum operating voltage, shared by
 * comparators, regulator power-good and supervisors. Watches two thresholds on the supply:
 * vmin (both directions) and, for `pulse-low`, the first rise above vstart.
 */
export class PowerOnGate {
  readonly watchCount = 2;
  private vmin = 0;
  private behaviour: PowerOnBehaviour = { kind: 'hiz' };
  private above = true;
  private started = false;
  private pulseEnd = -Infinity;
  private drive: OutputDrive = 'normal';

  configure(vmin: number, behaviour: PowerOnBehaviour): void {
    this.vmin = vmin;
    this.behaviour = behaviour;
  }

  reset(): void {
    this.started = false;
    this.pulseEnd = -Infinity;
    this.above = true;
    this.drive = 'normal';
  }

  /** Present drive; valid after `update`. */
  current(): OutputDrive {
    return this.drive;
  }

  /** Updates from the supply voltage at accepted time t; true if the drive changed. */
  update(t: number, supply: number, id: string, events: SimEvent[]): boolean {
    const b = this.behaviour;
    this.above = supply >= this.vmin;
    if (b.kind === 'pulse-low' && !this.started && supply > b.vstart) {
      this.started = true;
      this.pulseEnd = t + b.width;
      events.push({ t, element: id, what: 'power-on-pulse-start' });
    } else if (b.kind === 'pulse-low' && this.started && this.pulseEnd !== -Infinity) {
      if (t >= this.pulseEnd) {
        events.push({ t: this.pulseEnd, element: id, what: 'power-on-pulse-end' });
        this.pulseEnd = -Infinity;
      }
    }
    const next = this.decide(t);
    const changed = next !== this.drive;
    this.drive = next;
    return changed;
  }

  private decide(t: number): OutputDrive {
    const b = this.behaviour;
    if (b.kind === 'pulse-low') {
      if (this.started && t < this.pulseEnd) return 'low';
      if (this.above) return 'normal';
      return this.started ? (b.afterwards ?? 'hiz') : 'hiz';
    }
    return this.above ? 'normal' : b.kind;
  }

  /** End of a running power-on pulse, else Infinity. */
  nextDue(): number {
    return this.pulseEnd === -Infinity ? Infinity : this.pulseEnd;
  }

  /** Threshold function k (see BehaviouralModel.watch) for supply voltage `supply`. */
  watch(k: number, supply: number): number {
    if (k === 0) return this.above ? this.vmin - supply : supply - this.vmin;
    const b = this.behaviour;
    if (b.kind !== 'pulse-low' || this.started) return -1;
    return supply - b.vstart;
  }
}
