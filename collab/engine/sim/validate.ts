/**
 * Checks a netlist and simulation options before anything is built, so bad input gets a
 * `NetlistError` naming the part, net and field instead of a NaN or a crash later.
 */
import type { Element, Netlist, PowerOnBehaviour, SimOptions, SourceWaveform } from '../netlist';
import { NetlistError } from './errors';
import { buildTopology, netsOf, type Topology } from './topology';

/** Size limits: the dense solver is meant for board-level plans, not chips. */
export const LIMITS = {
  elements: 500,
  nets: 400,
  outputPoints: 200_000,
  pwlPoints: 100_000,
  monitors: 16,
} as const;

const KINDS = new Set([
  'resistor',
  'capacitor',
  'inductor',
  'vsource',
  'isource',
  'diode',
  'comparator',
  'regulator',
  'supervisor',
]);

type Check = (v: number) => boolean;
const finite: Check = (v) => Number.isFinite(v);
const positive: Check = (v) => Number.isFinite(v) && v > 0;
const nonNegative: Check = (v) => Number.isFinite(v) && v >= 0;
const RULE_TEXT = new Map<Check, string>([
  [finite, 'a finite number'],
  [positive, 'a finite number > 0'],
  [nonNegative, 'a finite number ≥ 0'],
]);

/** Throws unless `value` passes `check`; `field` may be a path such as `wave.t0`. */
function need(el: Element, field: string, value: unknown, check: Check): void {
  if (typeof value === 'number' && check(value)) return;
  throw new NetlistError(
    `${el.kind} '${el.id}': ${field} must be ${RULE_TEXT.get(check)} (got ${String(value)})`,
    { element: el.id, field },
  );
}

function optional(el: Element, field: string, value: unknown, check: Check): void {
  if (value !== undefined) need(el, field, value, check);
}

function fail(el: Element, field: string, why: string): never {
  throw new NetlistError(`${el.kind} '${el.id}': ${field} ${why}`, { element: el.id, field });
}

function checkWave(el: Element, w: SourceWaveform): void {
  switch (w?.kind) {
    case 'dc':
      return need(el, 'wave.value', w.value, finite);
    case 'step':
      need(el, 'wave.t0', w.t0, nonNegative);
      need(el, 'wave.v0', w.v0, finite);
      return need(el, 'wave.v1', w.v1, finite);
    case 'ramp':
      need(el, 'wave.t0', w.t0, nonNegative);
      need(el, 'wave.rise', w.rise, positive);
      need(el, 'wave.v0', w.v0, finite);
      return need(el, 'wave.v1', w.v1, finite);
    case 'exp':
      need(el, 'wave.t0', w.t0, nonNegative);
      need(el, 'wave.tau', w.tau, positive);
      need(el, 'wave.v0', w.v0, finite);
      return need(el, 'wave.v1', w.v1, finite);
    case 'pwl':
      return checkPwl(el, w.points);
    default:
      fail(
        el,
        'wave.kind',
        `is not one of dc, step, ramp, pwl, exp (got ${String((w as { kind?: unknown })?.kind)})`,
      );
  }
}

function checkPwl(el: Element, points: ReadonlyArray<readonly [number, number]>): void {
  if (!Array.isArray(points) || points.length === 0 || points.length > LIMITS.pwlPoints) {
    fail(el, 'wave.points', `must hold 1 to ${LIMITS.pwlPoints} [t, v] pairs`);
  }
  points.forEach((p, i) => {
    need(el, `wave.points[${i}][0]`, p?.[0], nonNegative);
    need(el, `wave.points[${i}][1]`, p?.[1], finite);
    if (i > 0 && !(p[0] > points[i - 1][0])) {
      fail(
        el,
        `wave.points[${i}][0]`,
        `must be later than the point before (${points[i - 1][0]} s)`,
      );
    }
  });
}

function checkPowerOn(el: Element, field: string, b: PowerOnBehaviour): void {
  if (b?.kind === 'low' || b?.kind === 'high' || b?.kind === 'hiz') return;
  if (b?.kind !== 'pulse-low') fail(el, `${field}.kind`, 'is not one of low, high, hiz, pulse-low');
  need(el, `${field}.vstart`, b.vstart, finite);
  need(el, `${field}.width`, b.width, positive);
  if (b.afterwards !== undefined && !['low', 'high', 'hiz'].includes(b.afterwards)) {
    fail(el, `${field}.afterwards`, 'is not one of low, high, hiz');
  }
}

/** Checks the numeric values of one element (kind and nets already checked). */
export function checkValues(el: Element): void {
  switch (el.kind) {
    case 'resistor':
      return need(el, 'ohms', el.ohms, positive);
    case 'capacitor':
      need(el, 'farads', el.farads, positive);
      return optional(el, 'v0', el.v0, finite);
    case 'inductor':
      need(el, 'henries', el.henries, positive);
      return optional(el, 'i0', el.i0, finite);
    case 'vsource':
      optional(el, 'rs', el.rs, nonNegative);
      return checkWave(el, el.wave);
    case 'isource':
      return checkWave(el, el.wave);
    case 'diode':
      if (el.model?.kind === 'shockley') {
        need(el, 'model.is', el.model.is, positive);
        return need(el, 'model.n', el.model.n, positive);
      }
      if (el.model?.kind === 'drop') {
        need(el, 'model.vf', el.model.vf, finite);
        return need(el, 'model.ron', el.model.ron, positive);
      }
      return fail(el, 'model.kind', 'is not one of shockley, drop');
    case 'comparator':
      return checkComparator(el);
    case 'regulator':
      return checkRegulator(el);
    case 'supervisor':
      return checkSupervisor(el);
  }
}

function checkComparator(el: Extract<Element, { kind: 'comparator' }>): void {
  need(el, 'threshold', el.threshold, finite);
  need(el, 'hysteresis', el.hysteresis, nonNegative);
  need(el, 'delay', el.delay, nonNegative);
  need(el, 'rout', el.rout, positive);
  need(el, 'vmin', el.vmin, finite);
  if (el.output !== 'push-pull' && el.output !== 'open-drain')
    fail(el, 'output', 'is not push-pull or open-drain');
  checkPowerOn(el, 'powerOn', el.powerOn);
}

function checkRegulator(el: Extract<Element, { kind: 'regulator' }>): void {
  need(el, 'vout', el.vout, positive);
  need(el, 'enOn', el.enOn, finite);
  need(el, 'enOff', el.enOff, finite);
  if (el.enOff > el.enOn) fail(el, 'enOff', `must not exceed enOn (${el.enOn} V)`);
  need(el, 'uvlo', el.uvlo, finite);
  need(el, 'softStart', el.softStart, nonNegative);
  optional(el, 'slewRate', el.slewRate, positive);
  need(el, 'dropout', el.dropout, nonNegative);
  need(el, 'rout', el.rout, positive);
  optional(el, 'rdischarge', el.rdischarge, positive);
  optional(el, 'ilimit', el.ilimit, positive);
  optional(el, 'pgThreshold', el.pgThreshold, positive);
  optional(el, 'pgDelay', el.pgDelay, nonNegative);
  optional(el, 'pgRon', el.pgRon, positive);
  optional(el, 'vmin', el.vmin, finite);
  if (el.pgPowerOn !== undefined) checkPowerOn(el, 'pgPowerOn', el.pgPowerOn);
}

function checkSupervisor(el: Extract<Element, { kind: 'supervisor' }>): void {
  if (
    !Array.isArray(el.monitors) ||
    el.monitors.length === 0 ||
    el.monitors.length > LIMITS.monitors
  ) {
    fail(el, 'monitors', `must list 1 to ${LIMITS.monitors} monitored nets`);
  }
  el.monitors.forEach((m, i) => {
    if (typeof m?.net !== 'string' || m.net === '')
      fail(el, `monitors[${i}].net`, 'must be a net name');
    need(el, `monitors[${i}].threshold`, m.threshold, finite);
    need(el, `monitors[${i}].hysteresis`, m.hysteresis, nonNegative);
  });
  need(el, 'timeout', el.timeout, nonNegative);
  need(el, 'delay', el.delay, nonNegative);
  need(el, 'rout', el.rout, positive);
  need(el, 'vmin', el.vmin, finite);
  checkPowerOn(el, 'powerOn', el.powerOn);
}

function checkStructure(el: Element, index: number, ids: Set<string>): void {
  if (el === null || typeof el !== 'object') {
    throw new NetlistError(`element #${index} is not an object`, {});
  }
  if (typeof el.id !== 'string' || el.id === '') {
    throw new NetlistError(`element #${index} (${String(el.kind)}) has no id`, {});
  }
  if (!KINDS.has(el.kind)) {
    throw new NetlistError(`element '${el.id}': unknown kind '${String(el.kind)}'`, {
      element: el.id,
      field: 'kind',
    });
  }
  if (ids.has(el.id))
    throw new NetlistError(`duplicate element id '${el.id}'`, { element: el.id, field: 'id' });
  ids.add(el.id);
  const nets = netsOf(el);
  nets.forEach((n) => {
    if (typeof n !== 'string' || n === '') fail(el, 'nets', 'must all be non-empty net names');
  });
  const twoTerminal = ['resistor', 'capacitor', 'inductor', 'vsource', 'isource', 'diode'].includes(
    el.kind,
  );
  if (twoTerminal && nets[0] === nets[1]) {
    throw new NetlistError(`${el.kind} '${el.id}' connects net '${nets[0]}' to itself`, {
      element: el.id,
      net: nets[0],
    });
  }
}

/**
 * Validates a netlist: kinds, ids, values, sizes, floating nets and ideal-source loops.
 * Returns the numbering of the unknowns. Throws `NetlistError` naming the part, net or field.
 */
export function validateNetlist(netlist: Netlist): Topology {
  if (netlist === null || typeof netlist !== 'object' || !Array.isArray(netlist.elements)) {
    throw new NetlistError('netlist must be an object with an elements array');
  }
  const elements = netlist.elements;
  if (elements.length === 0) throw new NetlistError('netlist has no elements');
  if (elements.length > LIMITS.elements) {
    throw new NetlistError(
      `netlist has ${elements.length} elements; the limit is ${LIMITS.elements}`,
    );
  }
  const t = netlist.temperature;
  if (t !== undefined && !(Number.isFinite(t) && t > -273.15 && t < 1000)) {
    throw new NetlistError(
      `temperature must be a finite °C value above −273.15 (got ${String(t)})`,
      {
        field: 'temperature',
      },
    );
  }
  const ids = new Set<string>();
  elements.forEach((el, i) => checkStructure(el, i, ids));
  elements.forEach(checkValues);
  const topology = buildTopology(elements);
  if (topology.nodeNames.length > LIMITS.nets) {
    throw new NetlistError(
      `netlist has ${topology.nodeNames.length} nets; the limit is ${LIMITS.nets}`,
    );
  }
  return topology;
}

/** Validates run options against the compiled nets; throws `NetlistError` naming the field. */
export function validateOptions(options: SimOptions, nets: ReadonlySet<string>): void {
  const bad = (field: string, rule: string, v: unknown): never => {
    throw new NetlistError(`options.${field} must be ${rule} (got ${String(v)})`, { field });
  };
  if (options === null || typeof options !== 'object') bad('tStop', 'given', options);
  const { tStop, outputPoints, maxStep, reltol, vntol, probes, toleranceScale } = options;
  if (!positive(tStop)) bad('tStop', 'a finite number > 0', tStop);
  if (
    outputPoints !== undefined &&
    !(Number.isInteger(outputPoints) && outputPoints >= 2 && outputPoints <= LIMITS.outputPoints)
  ) {
    bad('outputPoints', `an integer from 2 to ${LIMITS.outputPoints}`, outputPoints);
  }
  if (maxStep !== undefined && !positive(maxStep)) bad('maxStep', 'a finite number > 0', maxStep);
  if (reltol !== undefined && !(positive(reltol) && reltol <= 0.1))
    bad('reltol', 'in (0, 0.1]', reltol);
  if (vntol !== undefined && !positive(vntol)) bad('vntol', 'a finite number > 0', vntol);
  if (toleranceScale !== undefined) {
    if (toleranceScale === null || typeof toleranceScale !== 'object')
      bad('toleranceScale', 'an object of net → volts', toleranceScale);
    for (const [net, v] of Object.entries(toleranceScale)) {
      if (!nets.has(net))
        throw new NetlistError(`options.toleranceScale: unknown net '${net}'`, {
          net,
          field: 'toleranceScale',
        });
      if (!(typeof v === 'number' && Number.isFinite(v) && v >= 0))
        bad(`toleranceScale.${net}`, 'a finite number ≥ 0', v);
    }
  }
  for (const p of probes ?? []) {
    if (!nets.has(p))
      throw new NetlistError(`options.probes: unknown net '${p}'`, { net: p, field: 'probes' });
  }
}
