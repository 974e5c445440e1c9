/**
 * The small protocol every element model follows (one file per model under `elements/`), and
 * the helpers that add its contributions to the modified-nodal-analysis system.
 *
 * Unknowns are node voltages (ground excluded, index -1) followed by branch currents of ideal
 * voltage sources and inductors. Row r of the matrix is KCL at node r: the sum of currents
 * leaving the node through the elements equals the right-hand side.
 */
import type { Element, SimEvent } from '../netlist';
import type { IntegrationMethod } from './integration/integration-method';

/** Index of the ground net in the topology's net map (never an unknown). */
export const GROUND_INDEX = -1;

/**
 * The linear system being assembled for one Newton iteration. Models address ground as index
 * `size`: solution vectors carry one extra slot there that is always 0, so a model reads any
 * net voltage as x[i], and the stamp methods drop entries on that row or column. (Methods, not
 * free functions, keep the hot calls monomorphic whatever the module loader does.)
 */
export interface MnaSystem {
  readonly size: number;
  /** Row-major size×size. */
  readonly matrix: Float64Array;
  readonly rhs: Float64Array;
  /** Adds conductance g between unknowns a and b. */
  addConductance(a: number, b: number, g: number): void;
  /** A current i flowing from `from` through the part into `to`. */
  addCurrent(from: number, to: number, i: number): void;
  /** Adds v to matrix entry (row, col). */
  addEntry(row: number, col: number, v: number): void;
}

/** What the models need to know about the point being solved. */
export interface StepContext {
  /** Time at the end of the step. */
  t: number;
  /** Step length (a tiny value for the instantaneous re-solve after a jump). */
  h: number;
  method: IntegrationMethod;
  /** Evaluate sources at the left limit of t (a step that lands exactly on a jump). */
  left: boolean;
}

/** Common interface of all element models (interchangeable strategies, one per kind). */
export interface ElementModel {
  readonly id: string;
  /** Unknown indices the part touches (ground = size; for error messages). */
  readonly nodes: readonly number[];
  /**
   * True for a smooth nonlinearity (Shockley diode): Newton must also see the update shrink.
   * Piecewise-linear parts leave it false and report mode changes through `settled`.
   */
  readonly nonlinear: boolean;
  /** Reads the numeric values of `el` (same id, kind and nets as at compile time). */
  load(el: Element, vt: number): void;
  /** Restores the initial conditions of a run. */
  reset(): void;
  /** Adds the part's contributions, linearised around the iterate `x`. */
  stamp(s: MnaSystem, x: Float64Array, c: StepContext): void;
  /**
   * Whether the last stamp is still valid at the new iterate x: false if it was limited or
   * if a piecewise-linear part would now choose another segment.
   */
  settled(x: Float64Array): boolean;
  /** Commits the state of an accepted step solved at `c` with solution `x`. */
  accept(x: Float64Array, c: StepContext): void;
}

/**
 * A part whose matrix entries depend only on its loaded values and the integration coefficient
 * `c.method.coefficient(c.h)` (resistors, capacitors, inductors, independent sources). When
 * every part is linear and that coefficient is unchanged, the loop keeps the assembled matrix
 * and its LU factors and has each part add only its right-hand side.
 */
export interface LinearModel extends ElementModel {
  /**
   * Adds exactly the right-hand-side terms `stamp` would add at `c`, in the same order, and
   * updates the same internal state; the matrix is left alone.
   */
  stampRhs(s: MnaSystem, c: StepContext): void;
}

/** Whether `m` can add its right-hand side alone (see `LinearModel`). */
export function isLinearModel(m: ElementModel): m is LinearModel {
  return 'stampRhs' in m;
}

/** A part with discrete state: comparators, regulators, supervisors. */
export interface BehaviouralModel extends ElementModel {
  /** Number of threshold functions the transient loop watches for sign changes. */
  readonly watchCount: number;
  /**
   * Threshold function k at solution x: ≤ 0 while nothing is due, > 0 once the part's state
   * must change. The loop ends a step where one turns positive (located by interpolation).
   */
  watch(k: number, x: Float64Array): number;
  /** Updates the discrete state at accepted time t; true if the stamp changed. */
  update(t: number, x: Float64Array, events: SimEvent[]): boolean;
  /** Time of the next delayed action (Infinity if none). */
  nextDue(): number;
}

/** An independent source: its corners become breakpoints. */
export interface SourceModel extends ElementModel {
  corners(out: number[]): void;
  jumpsAt(t: number): boolean;
}
