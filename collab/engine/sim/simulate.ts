/**
 * Entry point of the transient simulator.
 *
 * `simulate(netlist, options)` validates, compiles and runs once. For many runs of one
 * topology (corners, Monte Carlo) call `compile(netlist)` once and then
 * `compiled.run(options, valuesNetlist)` per run.
 */
import type { Netlist, SimOptions, SimResult } from '../netlist';
import { compile } from './compile';

export { compile, CompiledCircuit, SIM_DEFAULTS } from './compile';
export type { CompileOptions } from './compile';
export { findCrossings } from './crossings';
export type { Crossing, CrossingDirection } from './crossings';
export {
  ConvergenceError,
  NetlistError,
  SingularMatrixError,
  TimestepUnderflowError,
} from './errors';
export { LIMITS, validateNetlist } from './validate';

/** Simulates `netlist` from t = 0 (capacitor v0 / inductor i0 initial conditions) to tStop. */
export function simulate(netlist: Netlist, options: SimOptions): SimResult {
  return compile(netlist).run(options);
}
