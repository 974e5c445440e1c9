/**
 * The contract between the analysis layer and the transient simulator.
 *
 * A `Netlist` is a flat list of elements with concrete values (tolerances, temperature and
 * Monte Carlo draws are already applied by the analysis layer). Values are SI units: seconds,
 * volts, amperes, ohms, farads, henries. Net names are free strings; `'0'` is ground.
 *
 * The simulator (`sim/`) consumes a `Netlist` and returns a `SimResult`; the analysis layer
 * evaluates requirements on any `SampledWaveform`, not only on simulator output, so bench
 * captures can be checked with the same code.
 */

/** Net name; `'0'` is ground. */
export type NetName = string;

export const GROUND: NetName = '0';

/** Time-dependent value of an independent source. */
export type SourceWaveform =
  | { kind: 'dc'; value: number }
  /** Ideal step from v0 to v1 at t0. */
  | { kind: 'step'; t0: number; v0: number; v1: number }
  /** Linear ramp from v0 (before t0) to v1 (after t0 + rise). */
  | { kind: 'ramp'; t0: number; rise: number; v0: number; v1: number }
  /** Piecewise-linear through [t, v] points (t strictly increasing); held at the ends. */
  | { kind: 'pwl'; points: ReadonlyArray<readonly [number, number]> }
  /** v0 before t0, then v1 + (v0 - v1)·exp(-(t - t0)/tau). */
  | { kind: 'exp'; t0: number; v0: number; v1: number; tau: number };

export interface ResistorElement {
  kind: 'resistor';
  id: string;
  a: NetName;
  b: NetName;
  ohms: number;
}

export interface CapacitorElement {
  kind: 'capacitor';
  id: string;
  a: NetName;
  b: NetName;
  farads: number;
  /** Initial voltage v(a) - v(b) at t = 0. Default 0. */
  v0?: number;
}

export interface InductorElement {
  kind: 'inductor';
  id: string;
  a: NetName;
  b: NetName;
  henries: number;
  /** Initial current from a to b at t = 0. Default 0. */
  i0?: number;
}

export interface VoltageSourceElement {
  kind: 'vsource';
  id: string;
  pos: NetName;
  neg: NetName;
  wave: SourceWaveform;
  /** Series resistance in ohms (0 = ideal). */
  rs?: number;
}

/** Current flows from `from` through the source into `to` (i.e. it is pushed into `to`). */
export interface CurrentSourceElement {
  kind: 'isource';
  id: string;
  from: NetName;
  to: NetName;
  wave: SourceWaveform;
}

export type DiodeModel =
  /** Shockley: i = is·(exp(v/(n·Vt)) − 1), Vt at the scenario temperature. */
  | { kind: 'shockley'; is: number; n: number }
  /** Piecewise-linear: off below vf, then a resistance ron. */
  | { kind: 'drop'; vf: number; ron: number };

export interface DiodeElement {
  kind: 'diode';
  id: string;
  anode: NetName;
  cathode: NetName;
  model: DiodeModel;
}

/**
 * What a part's output does while its own supply is below its minimum operating voltage.
 * `pulse-low`: output open (high impedance) until the supply first exceeds `vstart`, then driven
 * low for `width` seconds (even if the supply reaches vmin meanwhile: this is the power-on
 * glitch), then behaves as `afterwards` (default `'hiz'`) while the supply is still below vmin,
 * and normally once it is above. The pulse happens once per run.
 *
 * Contract change (sim engineer): `afterwards` added (optional) because the earlier JsDoc named
 * it without declaring it.
 */
export type PowerOnBehaviour =
  | { kind: 'low' }
  | { kind: 'high' }
  | { kind: 'hiz' }
  | {
      kind: 'pulse-low';
      vstart: number;
      width: number;
      afterwards?: 'low' | 'high' | 'hiz';
    };

/**
 * Comparator or switch. Output goes high when v(inP) − v(inN) rises above +hysteresis/2 relative
 * to `threshold` (i.e. v(inP) > v(inN) + threshold + hysteresis/2) and low below
 * threshold − hysteresis/2, after `delay` seconds. Push-pull output swings between gnd and
 * supply through `rout`; open-drain only pulls low through `rout` and is otherwise open
 * (a pull-up is an ordinary resistor in the netlist).
 *
 * Semantics fixed by the sim engineer: the delay is inertial (a decision that flips back before
 * `delay` has passed is dropped); at t = 0 the state is decided on the bare threshold with no
 * delay; when the supply reaches vmin the output takes the present decision at once.
 */
export interface ComparatorElement {
  kind: 'comparator';
  id: string;
  inP: NetName;
  inN: NetName;
  threshold: number;
  hysteresis: number;
  delay: number;
  supply: NetName;
  gnd: NetName;
  out: NetName;
  output: 'push-pull' | 'open-drain';
  /** Output resistance when driving, ohms. */
  rout: number;
  /** Minimum operating supply voltage v(supply) − v(gnd). */
  vmin: number;
  powerOn: PowerOnBehaviour;
}

/**
 * Behavioural linear regulator / converter. When v(en) − v(gnd) rises above enOn (and
 * v(in) is above uvlo) the output target ramps from its present value to `vout` over
 * `softStart` seconds (or at `slewRate` V/s if given), limited to v(in) − dropout; below enOff
 * the output is released and discharged through `rdischarge` (if given). The output has a
 * series resistance `rout`, and `ilimit` caps the output current when given. The power-good
 * output (open-drain, to `pg` net, pull-up is an ordinary resistor) is released `pgDelay`
 * seconds after v(out) rises above pgThreshold·vout and pulled low when it falls below it.
 *
 * Semantics fixed by the sim engineer: the input draws no current (ideal block; load the input
 * with a resistor if it matters); "present value" at enable is v(out) clamped to [0, vout] and
 * the ramp takes `softStart` seconds from there (or (vout − v0)/slewRate); pg is also pulled low
 * while the regulator is disabled or below uvlo. Defaults: pgThreshold 0.9, pgDelay 0,
 * pgRon 50 Ω, vmin 0, pgPowerOn `{ kind: 'hiz' }`. An open output leaks 1 GΩ to gnd.
 */
export interface RegulatorElement {
  kind: 'regulator';
  id: string;
  input: NetName;
  en: NetName;
  out: NetName;
  gnd: NetName;
  /** Power-good open-drain output net, optional. */
  pg?: NetName;
  vout: number;
  enOn: number;
  enOff: number;
  uvlo: number;
  softStart: number;
  slewRate?: number;
  dropout: number;
  rout: number;
  rdischarge?: number;
  ilimit?: number;
  /** Fraction of vout, e.g. 0.9. */
  pgThreshold?: number;
  pgDelay?: number;
  /** Pull-down resistance of the power-good output when asserted low. */
  pgRon?: number;
  /** Minimum input voltage for defined pg behaviour; below it pg follows `pgPowerOn`. */
  vmin?: number;
  pgPowerOn?: PowerOnBehaviour;
}

/**
 * Reset supervisor: `out` (open-drain, active low) is held low until every monitored net has
 * been above its threshold continuously for `timeout` seconds; pulled low again (after
 * `delay`) when any falls below threshold − hysteresis.
 *
 * Semantics fixed by the sim engineer: a pending assertion always fires (it is a propagation
 * delay, not a filter); afterwards the timeout restarts once every monitor is back above its
 * threshold. A monitor that dips below threshold − hysteresis before release restarts the timer.
 */
export interface SupervisorElement {
  kind: 'supervisor';
  id: string;
  supply: NetName;
  gnd: NetName;
  out: NetName;
  monitors: ReadonlyArray<{ net: NetName; threshold: number; hysteresis: number }>;
  timeout: number;
  delay: number;
  rout: number;
  vmin: number;
  powerOn: PowerOnBehaviour;
}

export type Element =
  | ResistorElement
  | CapacitorElement
  | InductorElement
  | VoltageSourceElement
  | CurrentSourceElement
  | DiodeElement
  | ComparatorElement
  | RegulatorElement
  | SupervisorElement;

export interface Netlist {
  elements: ReadonlyArray<Element>;
  /** Junction temperature for the run, °C (diode Vt). Default 25. */
  temperature?: number;
}

/**
 * Transient options. The run starts at t = 0 from the capacitor `v0` / inductor `i0` initial
 * conditions (no DC operating point: everything is unpowered unless a source says otherwise).
 * For repeated runs of one topology use `compile(netlist).run(options, values)` from
 * `sim/simulate.ts`.
 */
export interface SimOptions {
  /** End time, seconds. */
  tStop: number;
  /** Number of evenly spaced output points (interpolated from the adaptive steps). */
  outputPoints?: number;
  /** Largest internal step; default tStop / 50. */
  maxStep?: number;
  /**
   * Relative tolerance for the local truncation error (relative to the largest |v| the net has
   * reached so far); default 1e-4. Heavily ringing networks need 1e-5 for 0.1 % agreement;
   * Monte Carlo may use 1e-3.
   */
  reltol?: number;
  /** Absolute voltage tolerance; default 1e-6 V. */
  vntol?: number;
  /**
   * Per-net voltage, V, that the relative tolerance refers to from t = 0 (each net still widens
   * it to the largest |v| it reaches). Default: none, so a net near 0 V at the start is held to
   * `vntol`. Monte Carlo runs pass the nominal run's `peaks`: every run then gets the
   * tolerance the nominal run had reached by its end, from the start. (Corner analysis does
   * not: on the demo plan it saved under 10 % and moved noise-level sensitivities enough to
   * change which parts a worst-corner label names.)
   */
  toleranceScale?: Readonly<Record<NetName, number>>;
  /** Also keep the accepted internal steps (for crossing location); default true. */
  keepSteps?: boolean;
  /**
   * Nets to report (default: every net). Added by the sim engineer: Monte Carlo callers that
   * measure two or three nets avoid copying the others. Unknown names throw a `NetlistError`.
   */
  probes?: ReadonlyArray<NetName>;
}

/**
 * A signal sampled at non-decreasing times (a repeated time is a jump). Works for simulation
 * output and bench captures.
 */
export interface SampledWaveform {
  time: ArrayLike<number>;
  values: ArrayLike<number>;
}

/**
 * A discrete change of a part, at the located time (within 1e-9 relative of the threshold
 * crossing, or exactly at a delayed action's due time). The first event of each output at
 * t = 0 gives its initial level. `what` is one of: 'comparator-high' | 'comparator-low' (an
 * open output reads high), 'regulator-enabled' | 'regulator-disabled', 'soft-start-done',
 * 'pg-released' | 'pg-asserted', 'reset-released' | 'reset-asserted',
 * 'power-on-pulse-start' | 'power-on-pulse-end'.
 */
export interface SimEvent {
  t: number;
  element: string;
  what: string;
}

/**
 * The accepted internal time points. At an instantaneous change (step source, part output
 * switching) the same time appears twice: first the value just before, then just after, so
 * interpolation between points never smears a jump.
 */
export interface SimSteps {
  time: Float64Array;
  nets: Record<NetName, Float64Array>;
}

export interface SimResult {
  /** Output time axis. */
  time: Float64Array;
  /** Voltage of every net (ground included) at each output time. */
  nets: Record<NetName, Float64Array>;
  /** Discrete events located exactly (not by sampling). */
  events: SimEvent[];
  /** Accepted internal steps; present unless `keepSteps: false`. Added by the sim engineer. */
  steps?: SimSteps;
  /**
   * Largest |v| of every net (ground excluded) over the run, V, or its `toleranceScale` if that
   * was larger: the tolerance reference each net ended the run with.
   */
  peaks: Record<NetName, number>;
  stats: {
    acceptedSteps: number;
    rejectedSteps: number;
    newtonIterations: number;
    luFactorisations: number;
  };
}
