/**
 * Compiling a netlist once and running it many times. `compile` validates, numbers the unknowns
 * and builds the element models and buffers; `run` loads values and simulates. Monte Carlo
 * passes a netlist with the same parts and nets but other values to `run`, which skips the
 * topology work and reuses every buffer.
 */
import { GROUND, type Netlist, type NetName, type SimOptions, type SimResult } from '../netlist';
import { NetlistError } from './errors';
import { thermalVoltage } from './math';
import { MnaSolver } from './mna-solver';
import { buildModel } from './build-models';
import type { BehaviouralModel, ElementModel, SourceModel } from './stamp';
import { netsOf, type Topology } from './topology';
import { TransientRunner } from './transient';
import { checkValues, validateNetlist, validateOptions } from './validate';

/** Defaults of `SimOptions`. */
export const SIM_DEFAULTS = {
  outputPoints: 1000,
  maxStepFraction: 1 / 50,
  reltol: 1e-4,
  vntol: 1e-6,
} as const;

function isBehavioural(m: ElementModel): m is BehaviouralModel {
  return 'watchCount' in m;
}

function isSource(m: ElementModel): m is SourceModel {
  return 'corners' in m;
}

/** How a circuit is compiled. */
export interface CompileOptions {
  /**
   * Solve networks made only of linear parts once per step and keep their matrix while the step
   * is unchanged (`LinearStepper`). Results are bit-identical either way; turning it off is for
   * checking exactly that. @default true
   */
  linearFastPath?: boolean;
}

/** A validated circuit ready to be simulated repeatedly. */
export class CompiledCircuit {
  /** Every net, ground first. */
  readonly nets: readonly NetName[];
  private readonly topo: Topology;
  private readonly netSet: ReadonlySet<NetName>;
  private readonly models: ElementModel[];
  private readonly runner: TransientRunner;
  private readonly signature: string[];
  private readonly scaleBuffer: Float64Array;

  constructor(
    private netlist: Netlist,
    options: CompileOptions = {},
  ) {
    this.topo = validateNetlist(netlist);
    this.nets = [GROUND, ...this.topo.nodeNames];
    this.netSet = new Set(this.nets);
    this.models = netlist.elements.map((el) => buildModel(el, this.topo));
    this.signature = netlist.elements.map(signatureOf);
    this.scaleBuffer = new Float64Array(this.topo.nodeNames.length);
    const solver = new MnaSolver(this.topo.size, this.topo.unknownNames);
    this.runner = new TransientRunner({
      size: this.topo.size,
      nodeCount: this.topo.nodeNames.length,
      models: this.models,
      behavioural: this.models.filter(isBehavioural),
      sources: this.models.filter(isSource),
      solver,
      linearFastPath: options.linearFastPath ?? true,
    });
  }

  /**
   * Simulates with the compiled values, or with those of `values`: a netlist with the same
   * element ids, kinds and nets in the same order (only numbers may differ). Throws
   * `NetlistError` on bad options, bad values or a different topology.
   */
  run(options: SimOptions, values?: Netlist): SimResult {
    validateOptions(options, this.netSet);
    if (values !== undefined) this.useValues(values);
    const vt = thermalVoltage(this.netlist.temperature ?? 25);
    this.netlist.elements.forEach((el, i) => this.models[i].load(el, vt));
    const tStop = options.tStop;
    const { events, stats } = this.runner.run({
      tStop,
      maxStep: Math.min(options.maxStep ?? tStop * SIM_DEFAULTS.maxStepFraction, tStop),
      reltol: options.reltol ?? SIM_DEFAULTS.reltol,
      vntol: options.vntol ?? SIM_DEFAULTS.vntol,
      scale: this.scaleOf(options.toleranceScale),
    });
    return this.result(options, events, stats);
  }

  /** `toleranceScale` by node index (unnamed nodes 0), in a buffer reused across runs. */
  private scaleOf(byNet: SimOptions['toleranceScale']): Float64Array | undefined {
    if (byNet === undefined) return undefined;
    const scale = this.scaleBuffer;
    scale.fill(0);
    for (const net in byNet) {
      const i = this.topo.nodeIndex.get(net);
      if (i !== undefined && i >= 0) scale[i] = byNet[net];
    }
    return scale;
  }

  private useValues(values: Netlist): void {
    const els = values?.elements;
    if (!Array.isArray(els) || els.length !== this.signature.length) {
      throw new NetlistError(
        `values netlist must have the compiled ${this.signature.length} elements (got ${String(els?.length)})`,
      );
    }
    els.forEach((el, i) => {
      if (signatureOf(el) !== this.signature[i]) {
        throw new NetlistError(
          `element #${i} ('${String(el?.id)}') differs in id, kind, nets or ideal-source rs from the compiled netlist; compile it anew`,
          { element: el?.id },
        );
      }
      checkValues(el);
    });
    const t = values.temperature;
    if (t !== undefined && !(Number.isFinite(t) && t > -273.15 && t < 1000)) {
      throw new NetlistError(
        `temperature must be a finite °C value above −273.15 (got ${String(t)})`,
        {
          field: 'temperature',
        },
      );
    }
    this.netlist = values;
  }

  private result(
    options: SimOptions,
    events: SimResult['events'],
    stats: SimResult['stats'],
  ): SimResult {
    const n = options.outputPoints ?? SIM_DEFAULTS.outputPoints;
    const time = new Float64Array(n);
    for (let k = 0; k < n; k++) time[k] = (options.tStop * k) / (n - 1);
    const rec = this.runner.recorder;
    const probes = options.probes ?? this.nets;
    const nets: Record<NetName, Float64Array> = {};
    for (const net of probes)
      nets[net] = rec.resample(this.topo.nodeIndex.get(net) as number, time);
    const peaks: Record<NetName, number> = {};
    this.topo.nodeNames.forEach((net, i) => (peaks[net] = this.runner.peak(i)));
    const result: SimResult = { time, nets, events, stats, peaks };
    if (options.keepSteps ?? true) {
      const stepNets: Record<NetName, Float64Array> = {};
      for (const net of probes)
        stepNets[net] = rec.stepValues(this.topo.nodeIndex.get(net) as number);
      result.steps = { time: rec.stepTimes(), nets: stepNets };
    }
    return result;
  }
}

/** What must stay equal for compiled buffers to be reused. */
function signatureOf(el: Netlist['elements'][number]): string {
  if (el === null || typeof el !== 'object') return '';
  const ideal = el.kind === 'vsource' ? String(el.rs === undefined || el.rs === 0) : '';
  let nets: string[];
  try {
    nets = netsOf(el);
  } catch {
    // A malformed element (e.g. supervisor without monitors) simply does not match.
    return '';
  }
  return `${el.id}|${el.kind}|${nets.join(',')}|${ideal}`;
}

/** Validates and compiles `netlist` for repeated runs (see `CompiledCircuit.run`). */
export function compile(netlist: Netlist, options?: CompileOptions): CompiledCircuit {
  return new CompiledCircuit(netlist, options);
}
