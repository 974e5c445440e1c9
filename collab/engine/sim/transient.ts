/**
 * The transient loop: adaptive steps with truncation-error control, breakpoints at source
 * corners and delayed part actions, exact location of threshold crossings, and an
 * instantaneous re-solve after every jump. Buffers belong to the runner and are reused by every
 * run of the same compiled circuit, so the loop itself allocates nothing per step.
 */
import type { SimEvent } from '../netlist';
import { ConvergenceError, TimestepUnderflowError } from './errors';
import { backwardEuler } from './integration/backward-euler';
import type { IntegrationMethod } from './integration/integration-method';
import { trapezoidal } from './integration/trapezoidal';
import { LinearStepper } from './linear-stepper';
import { copyInto, inverseRoot } from './math';
import type { MnaSolver } from './mna-solver';
import { SolutionHistory } from './solution-history';
import {
  isLinearModel,
  type BehaviouralModel,
  type ElementModel,
  type SourceModel,
  type StepContext,
} from './stamp';
import { StepRecorder } from './step-recorder';

/** Options after defaults are applied. */
export interface TransientSettings {
  tStop: number;
  maxStep: number;
  reltol: number;
  vntol: number;
  /** Per node unknown: the voltage the relative tolerance refers to from t = 0 (else 0). */
  scale?: Float64Array;
}

export interface TransientStats {
  acceptedSteps: number;
  rejectedSteps: number;
  newtonIterations: number;
  luFactorisations: number;
}

/** First step after a discontinuity, as a fraction of the largest step. */
const FIRST_STEP_FRACTION = 1e-2;
/** Growth below this factor keeps the previous step, so the LU factors can be reused. */
const MIN_GROWTH = 1.5;
/** Largest growth of the step from one accepted step to the next. */
const MAX_GROWTH = 4;
/** Smallest step, relative to tStop. */
const MIN_STEP_FRACTION = 1e-13;
/** Length of the instantaneous re-solve, relative to tStop (capacitors nearly frozen). */
const FROZEN_STEP_FRACTION = 1e-9;
/** Event location accuracy, relative to the event time. */
const EVENT_RELTOL = 1e-9;
const MAX_NEWTON = 60;
const MAX_SETTLE = 25;
const MAX_AIMS = 40;
/** Accepted plus rejected steps allowed in one run before giving up. */
const MAX_ATTEMPTS = 2_000_000;
/** Branch currents converge on this absolute tolerance, A. */
const ABSTOL = 1e-12;

export interface CircuitParts {
  readonly size: number;
  readonly nodeCount: number;
  readonly models: readonly ElementModel[];
  readonly behavioural: readonly BehaviouralModel[];
  readonly sources: readonly SourceModel[];
  readonly solver: MnaSolver;
  /** Use the linear-network path when every part allows it; default true (tests turn it off). */
  readonly linearFastPath?: boolean;
}

export class TransientRunner {
  readonly recorder: StepRecorder;
  private readonly history: SolutionHistory;
  private x: Float64Array;
  private xNew: Float64Array;
  private readonly xAccepted: Float64Array;
  private readonly gStart: Float64Array;
  private readonly watchOwner: Int32Array;
  private readonly watchIndex: Int32Array;
  private readonly smooth: boolean;
  /** Set when every part is linear: one exact solve per step, matrix kept (see LinearStepper). */
  private readonly linear: LinearStepper | null;
  private readonly ctx: StepContext = { t: 0, h: 1, method: backwardEuler, left: false };
  private s: TransientSettings = { tStop: 1, maxStep: 1, reltol: 1e-4, vntol: 1e-6 };
  private breakpoints: number[] = [];
  private bpIndex = 0;
  private events: SimEvent[] = [];
  private stats: TransientStats = this.freshStats();

  constructor(private readonly c: CircuitParts) {
    this.recorder = new StepRecorder(c.nodeCount);
    this.history = new SolutionHistory(c.nodeCount);
    // One extra slot: ground, always 0 (see MnaSystem).
    this.x = new Float64Array(c.size + 1);
    this.xNew = new Float64Array(c.size + 1);
    this.xAccepted = new Float64Array(c.size + 1);
    const owners: number[] = [];
    const indices: number[] = [];
    c.behavioural.forEach((m, i) => {
      for (let k = 0; k < m.watchCount; k++) {
        owners.push(i);
        indices.push(k);
      }
    });
    this.watchOwner = Int32Array.from(owners);
    this.watchIndex = Int32Array.from(indices);
    this.gStart = new Float64Array(owners.length);
    this.smooth = c.models.some((m) => m.nonlinear);
    const linear = c.models.filter(isLinearModel);
    this.linear =
      linear.length === c.models.length && c.linearFastPath !== false
        ? new LinearStepper(linear, c.solver)
        : null;
  }

  private freshStats(): TransientStats {
    return { acceptedSteps: 0, rejectedSteps: 0, newtonIterations: 0, luFactorisations: 0 };
  }

  /** Largest |v| node unknown `i` reached in the last run (its tolerance scale). */
  peak(i: number): number {
    return this.history.peak(i);
  }

  /** Runs one transient; models must already hold this run's values. */
  run(settings: TransientSettings): { events: SimEvent[]; stats: TransientStats } {
    this.s = settings;
    this.events = [];
    this.stats = this.freshStats();
    this.c.solver.resetCount();
    this.linear?.reset();
    this.recorder.clear();
    this.history.startRun(settings.reltol, settings.vntol, settings.scale);
    for (const m of this.c.models) m.reset();
    this.collectBreakpoints();
    this.x.fill(0);
    this.solveFrozen(0);
    this.settle(0);
    this.recorder.push(0, this.x);
    this.startSegment(0);
    this.loop();
    this.stats.luFactorisations = this.c.solver.factorisations;
    return { events: this.events, stats: this.stats };
  }

  private collectBreakpoints(): void {
    const all: number[] = [];
    for (const src of this.c.sources) src.corners(all);
    all.sort((a, b) => a - b);
    const tStop = this.s.tStop;
    this.breakpoints = all.filter((t, i) => t > 0 && t < tStop && (i === 0 || t !== all[i - 1]));
    this.breakpoints.push(tStop);
    this.bpIndex = 0;
  }

  /** Next breakpoint strictly after t: source corner, tStop or a part's delayed action. */
  private nextBreakpoint(t: number, hMin: number): number {
    const bps = this.breakpoints;
    while (this.bpIndex < bps.length - 1 && bps[this.bpIndex] <= t + hMin) this.bpIndex++;
    let next = bps[this.bpIndex];
    for (const m of this.c.behavioural) {
      const due = m.nextDue();
      if (due > t + hMin && due < next) next = due;
    }
    return next;
  }

  private loop(): void {
    const { tStop, maxStep } = this.s;
    const hMin = tStop * MIN_STEP_FRACTION;
    let t = 0;
    let h = this.firstStep(hMin);
    let aims = 0;
    let hBeforeAim = 0;
    let retry = false;
    while (t < tStop) {
      if (this.stats.acceptedSteps + this.stats.rejectedSteps > MAX_ATTEMPTS) {
        throw new TimestepUnderflowError(t, h, this.partsNear(this.history.worst), 'step budget');
      }
      const tBp = this.nextBreakpoint(t, hMin);
      let hTry = Math.min(h, maxStep);
      let landed = false;
      // Stretch onto a close breakpoint rather than leave a sliver, except while aiming at a
      // crossing, where the aimed length must be kept, and after a rejection, where stretching
      // would undo the reduction.
      if (t + hTry >= tBp || (aims === 0 && !retry && tBp - (t + hTry) < 0.25 * hTry)) {
        hTry = tBp - t;
        landed = true;
      }
      const tEnd = landed ? tBp : t + hTry;
      const method: IntegrationMethod = this.history.count >= 3 ? trapezoidal : backwardEuler;
      // Newton starts from the last accepted point; a linear solve needs no starting point.
      if (this.linear === null) copyInto(this.x, this.xAccepted);
      if (!this.newton(tEnd, hTry, method, landed)) {
        this.stats.rejectedSteps++;
        retry = true;
        h = hTry / 2;
        if (h < hMin) throw new ConvergenceError(tEnd, this.unsettledParts());
        continue;
      }
      const tCross = this.gStart.length > 0 ? this.earliestCrossing(t, hTry) : Infinity;
      if (tCross < Infinity) {
        const tol = EVENT_RELTOL * Math.max(tCross, hMin);
        if (tEnd - tCross > tol && aims < MAX_AIMS) {
          this.stats.rejectedSteps++;
          if (aims === 0) hBeforeAim = hTry;
          aims++;
          h = tCross - t + tol / 2;
          continue;
        }
      }
      const ratio = this.history.errorRatio(this.x, tEnd, method);
      const shrink = ratio > 0 ? 0.9 * inverseRoot(ratio, method.order) : MAX_GROWTH;
      if (ratio > 1) {
        this.stats.rejectedSteps++;
        retry = true;
        h = hTry * Math.max(0.1, shrink);
        if (h < hMin) throw new TimestepUnderflowError(t, h, this.partsNear(this.history.worst));
        continue;
      }
      const aimed = aims > 0;
      aims = 0;
      retry = false;
      this.accept(tEnd, hTry, method, landed);
      t = tEnd;
      const jumped = this.afterAccept(t, landed);
      if (landed || jumped) {
        this.startSegment(t);
        h = this.firstStep(hMin);
      } else {
        // After a located crossing that changed no stamp (a delayed output), resume the step
        // length used before aiming instead of growing from the short aimed step.
        h = aimed ? hBeforeAim : hTry * Math.min(MAX_GROWTH, shrink);
        h = Math.min(h, this.history.interpolationLimit());
        // Small growth is not worth a new LU factorisation: keep the step (and the factors).
        if (h > hTry && h < MIN_GROWTH * hTry && !landed) h = hTry;
      }
    }
  }

  private accept(t: number, h: number, method: IntegrationMethod, left: boolean): void {
    const ctx = this.ctx;
    ctx.t = t;
    ctx.h = h;
    ctx.method = method;
    ctx.left = left;
    for (const m of this.c.models) m.accept(this.x, ctx);
    this.stats.acceptedSteps++;
    this.recorder.push(t, this.x);
    this.history.push(t, this.x);
    copyInto(this.xAccepted, this.x);
  }

  /** Discrete updates at an accepted time; true if something jumped (re-solved). */
  private afterAccept(t: number, landed: boolean): boolean {
    let jump = false;
    if (landed) for (const src of this.c.sources) if (src.jumpsAt(t)) jump = true;
    const changed = this.updateParts(t);
    if (!jump && !changed) {
      this.computeWatchStart();
      return false;
    }
    this.solveFrozen(t);
    this.settle(t);
    this.recorder.push(t, this.x);
    this.xAccepted.set(this.x);
    return true;
  }

  private startSegment(t: number): void {
    this.history.clear();
    this.history.push(t, this.xAccepted);
    this.computeWatchStart();
  }

  /** First step of a segment; landing on a nearer breakpoint clips it anyway. */
  private firstStep(hMin: number): number {
    return Math.max(this.s.maxStep * FIRST_STEP_FRACTION, hMin * 10);
  }

  /**
   * Instantaneous solve at t: a backward-Euler step so short that capacitor voltages and
   * inductor currents move only as far as charge conservation forces them (a capacitive
   * divider jumps by C1/(C1+C2)). The step is committed but takes no time on the axis.
   */
  private solveFrozen(t: number): void {
    this.x.set(this.xAccepted);
    const h = this.s.tStop * FROZEN_STEP_FRACTION;
    if (!this.newton(t, h, backwardEuler, false)) {
      throw new ConvergenceError(t, this.unsettledParts());
    }
    for (const m of this.c.models) m.accept(this.x, this.ctx);
    this.xAccepted.set(this.x);
  }

  /** Lets part states follow the solution until nothing changes any more. */
  private settle(t: number): void {
    for (let k = 0; k < MAX_SETTLE; k++) {
      if (!this.updateParts(t)) {
        this.computeWatchStart();
        return;
      }
      this.solveFrozen(t);
    }
    throw new ConvergenceError(
      t,
      this.c.behavioural.map((m) => m.id),
    );
  }

  private updateParts(t: number): boolean {
    let changed = false;
    for (const m of this.c.behavioural)
      if (m.update(t, this.xAccepted, this.events)) changed = true;
    return changed;
  }

  private computeWatchStart(): void {
    const b = this.c.behavioural;
    for (let w = 0; w < this.gStart.length; w++) {
      this.gStart[w] = b[this.watchOwner[w]].watch(this.watchIndex[w], this.xAccepted);
    }
  }

  /** Earliest interpolated time in (t, t + h] where a watch turns positive, else Infinity. */
  private earliestCrossing(t: number, h: number): number {
    const b = this.c.behavioural;
    let best = Infinity;
    for (let w = 0; w < this.gStart.length; w++) {
      const g0 = this.gStart[w];
      if (g0 > 0) continue;
      const g1 = b[this.watchOwner[w]].watch(this.watchIndex[w], this.x);
      if (!(g1 > 0)) continue;
      const tc = t + (h * -g0) / (g1 - g0);
      if (tc < best) best = tc;
    }
    return best;
  }

  /** Newton–Raphson at time t; the iterate starts from this.x and ends there. */
  private newton(t: number, h: number, method: IntegrationMethod, left: boolean): boolean {
    const { solver, models, nodeCount, size } = this.c;
    const ctx = this.ctx;
    ctx.t = t;
    ctx.h = h;
    ctx.method = method;
    ctx.left = left;
    if (this.linear !== null) {
      this.linear.solve(this.x, this.xNew, ctx);
      this.stats.newtonIterations++;
      return this.takeIterate(size);
    }
    const reltol = this.s.reltol;
    for (let iter = 0; iter < MAX_NEWTON; iter++) {
      solver.clear();
      for (const m of models) m.stamp(solver, this.x, ctx);
      solver.solve(this.xNew, t);
      this.stats.newtonIterations++;
      let small = true;
      for (let i = 0; i < size; i++) {
        const a = this.xNew[i];
        if (!Number.isFinite(a)) return false;
        // Without smooth nonlinearities the update size decides nothing (see the return below).
        if (!this.smooth) continue;
        const tol =
          reltol * Math.max(Math.abs(a), Math.abs(this.x[i])) +
          (i < nodeCount ? this.s.vntol : ABSTOL);
        if (Math.abs(a - this.x[i]) > tol) small = false;
      }
      let settled = true;
      for (const m of models) if (!m.settled(this.xNew)) settled = false;
      const swap = this.x;
      this.x = this.xNew;
      this.xNew = swap;
      if (settled && (!this.smooth || (iter > 0 && small))) return true;
    }
    return false;
  }

  /** Makes the solve in xNew the iterate, unless it is not finite. */
  private takeIterate(size: number): boolean {
    const xNew = this.xNew;
    for (let i = 0; i < size; i++) if (!Number.isFinite(xNew[i])) return false;
    this.xNew = this.x;
    this.x = xNew;
    return true;
  }

  private unsettledParts(): string[] {
    const ids = this.c.models.filter((m) => m.nonlinear || !m.settled(this.x)).map((m) => m.id);
    return ids.length > 0 ? ids : this.c.models.map((m) => m.id).slice(0, 8);
  }

  private partsNear(node: number): string[] {
    if (node < 0) return [];
    return this.c.models.filter((m) => m.nodes.includes(node)).map((m) => m.id);
  }
}
