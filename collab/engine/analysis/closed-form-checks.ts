/**
 * Finds sub-networks of a plan that reduce to a first-order closed form and compares the
 * closed-form crossing times with the simulated ones:
 * - an RC low-pass fed by an ideal voltage source (step → 1 − e^(−t/τ), input ramp → ramp response);
 * - an RC delay fed through a pull-up when an open-drain output releases (τ = (Rpu + R)·C).
 */
import { GROUND, type SimEvent } from '../netlist';
import type { Plan } from '../plan/plan-schema';
import type { PartSpec } from '../plan/plan-schema-parts';
import { partPins } from '../plan/part-pins';
import type { ScenarioCase } from '../plan/scenarios';
import {
  capResDividerResponse,
  capResDividerStep,
  rcDelayToThreshold,
  rcRampResponse,
} from './closed-form';
import { netWave, type CaseRun } from './plan-runner';
import type { ClosedFormCheck } from './result-types';
import { firstCrossing, valueAt } from './waveform-ops';

type Resistor = Extract<PartSpec, { kind: 'resistor' }>;
type Capacitor = Extract<PartSpec, { kind: 'capacitor' }>;

/** Pins that draw no current in the behavioural models. */
function isHighImpedance(part: PartSpec, pin: string): boolean {
  if (part.kind === 'comparator') return pin === 'inP' || pin === 'inN';
  if (part.kind === 'regulator') return pin === 'en';
  if (part.kind === 'supervisor') return pin.startsWith('monitor');
  return false;
}

function isOpenDrain(part: PartSpec, pin: string): boolean {
  if (part.kind === 'regulator') return pin === 'pg';
  if (part.kind === 'supervisor') return pin === 'out';
  return part.kind === 'comparator' && pin === 'out' && part.output === 'open-drain';
}

interface Touch {
  part: PartSpec;
  pin: string;
}

function touches(plan: Plan, net: string): Touch[] {
  return plan.parts.flatMap((part) =>
    partPins(part)
      .filter((p) => p.net === net)
      .map((p) => ({ part, pin: p.pin })),
  );
}

const other = (r: Resistor | Capacitor, net: string): string => (r.a === net ? r.b : r.a);

/** Threshold levels on a net: named signal thresholds and enable thresholds of consumers. */
function levelsOn(plan: Plan, net: string): Array<{ level: number; what: string }> {
  const out: Array<{ level: number; what: string }> = [];
  for (const s of plan.signals.filter((x) => x.net === net)) {
    for (const [name, level] of Object.entries(s.thresholds ?? {}))
      out.push({ level, what: `${s.id} ${name}` });
  }
  for (const p of plan.parts) {
    if (p.kind === 'regulator' && p.en === net) out.push({ level: p.enOn, what: `${p.id} enOn` });
  }
  return out.filter((x, i) => out.findIndex((y) => y.level === x.level) === i);
}

interface RcNode {
  net: string;
  r: Resistor;
  c: Capacitor;
  drive: string;
}

/** Nets with exactly one series resistor, one capacitor to ground and only high-impedance loads. */
function rcNodes(plan: Plan): RcNode[] {
  const out: RcNode[] = [];
  for (const { id: net } of plan.nets) {
    const t = touches(plan, net);
    const rs = t.filter((x) => x.part.kind === 'resistor').map((x) => x.part as Resistor);
    const cs = t.filter((x) => x.part.kind === 'capacitor').map((x) => x.part as Capacitor);
    const rest = t.filter((x) => x.part.kind !== 'resistor' && x.part.kind !== 'capacitor');
    if (rs.length !== 1 || cs.length !== 1 || other(cs[0], net) !== GROUND) continue;
    if (!rest.every((x) => isHighImpedance(x.part, x.pin)) || (cs[0].v0 ?? 0) !== 0) continue;
    out.push({ net, r: rs[0], c: cs[0], drive: other(rs[0], net) });
  }
  return out;
}

function check(
  id: string,
  description: string,
  c: ScenarioCase,
  closedForm: number,
  simulated: number | undefined,
  note?: string,
): ClosedFormCheck {
  const sim = simulated ?? null;
  const diff = sim === null ? null : sim - closedForm;
  return {
    id,
    description,
    scenarioId: c.scenarioId,
    temperature: c.temperature,
    closedForm,
    unit: 's',
    simulated: sim,
    difference: diff,
    relativeDifference: diff === null || closedForm === 0 ? null : diff / closedForm,
    ...(note === undefined ? {} : { note }),
  };
}

/** Solves rcRampResponse(t) = level for t by bisection (the response is monotonic). */
function rampCrossing(tau: number, v: number, rise: number, level: number): number | null {
  if (!(level > 0 && level < v)) return null;
  let lo = 0;
  let hi = rise + 60 * tau;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (rcRampResponse(mid, tau, v, rise) < level) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

function sourceDriven(
  plan: Plan,
  node: RcNode,
  c: ScenarioCase,
  run: CaseRun,
  values: ReadonlyMap<string, number>,
): ClosedFormCheck[] {
  const src = plan.parts.find(
    (p) =>
      p.kind === 'vsource' &&
      p.pos === node.drive &&
      p.neg === GROUND &&
      !(p.rs !== undefined && p.rs > 0),
  );
  if (src === undefined || src.kind !== 'vsource') return [];
  const v = values.get(src.id) ?? src.value;
  const tau = (values.get(node.r.id) ?? node.r.value) * (values.get(node.c.id) ?? node.c.value);
  const wave = netWave(run.sim, node.net);
  if (wave === undefined) return [];
  const out: ClosedFormCheck[] = [];
  const ramp = src.role === 'input' && c.inputShape.length === 2 ? c.inputShape[1][0] : undefined;
  const step = src.role !== 'input' && src.wave?.kind === 'step' ? src.wave.t0 : undefined;
  for (const { level, what } of levelsOn(plan, node.net)) {
    const t =
      ramp !== undefined
        ? rampCrossing(tau, v, ramp, level)
        : step !== undefined
          ? rcDelayToThreshold(tau, level, v)
          : null;
    if (t === null) continue;
    const t0 = step ?? 0;
    const sim = firstCrossing(wave, level, 'rise');
    out.push(
      check(
        `${node.r.id}-${node.c.id}-${what}`,
        `${node.r.id}·${node.c.id} from ${src.id} to ${level} V (${what})`,
        c,
        t0 + t,
        sim,
      ),
    );
  }
  return out;
}

function releaseTime(
  events: readonly SimEvent[],
  owner: string,
  before: number,
): number | undefined {
  let t: number | undefined;
  for (const e of events)
    if (e.element === owner && e.t <= before && /releas|high/.test(e.what)) t = e.t;
  return t;
}

function pullUpDriven(
  plan: Plan,
  node: RcNode,
  c: ScenarioCase,
  run: CaseRun,
  values: ReadonlyMap<string, number>,
): ClosedFormCheck[] {
  const t = touches(plan, node.drive).filter((x) => x.part.id !== node.r.id);
  const pullUps = t.filter((x) => x.part.kind === 'resistor').map((x) => x.part as Resistor);
  const drains = t.filter((x) => isOpenDrain(x.part, x.pin));
  if (pullUps.length !== 1 || drains.length !== 1 || t.length !== 2) return [];
  const supplyNet = other(pullUps[0], node.drive);
  const supply = run.sim.nets[supplyNet];
  const wave = netWave(run.sim, node.net);
  if (supply === undefined || wave === undefined) return [];
  const rTotal =
    (values.get(pullUps[0].id) ?? pullUps[0].value) + (values.get(node.r.id) ?? node.r.value);
  const tau = rTotal * (values.get(node.c.id) ?? node.c.value);
  const out: ClosedFormCheck[] = [];
  for (const { level, what } of levelsOn(plan, node.net)) {
    const crossing = firstCrossing(wave, level, 'rise', c.windowStart);
    if (crossing === undefined) continue;
    const released = releaseTime(run.sim.events, drains[0].part.id, crossing);
    if (released === undefined) continue;
    // The node starts from where the asserted (pulled-low) output left it, not exactly 0 V.
    const vs = supply[supply.length - 1];
    const delay = rcDelayToThreshold(tau, level, vs, valueAt(wave, released));
    if (delay === null) continue;
    out.push(
      check(
        `${pullUps[0].id}-${node.r.id}-${node.c.id}-${what}`,
        `(${pullUps[0].id} + ${node.r.id})·${node.c.id} delay from ${drains[0].part.id} release to ${level} V (${what})`,
        c,
        delay,
        crossing - released,
        'assumes the pull-up supply has settled at the release',
      ),
    );
  }
  return out;
}

/** Closed-form checks for one nominal case run. */
export function closedFormChecks(
  plan: Plan,
  c: ScenarioCase,
  run: CaseRun,
  values: ReadonlyMap<string, number>,
): ClosedFormCheck[] {
  return [
    ...rcNodes(plan).flatMap((node) => [
      ...sourceDriven(plan, node, c, run, values),
      ...pullUpDriven(plan, node, c, run, values),
    ]),
    ...dividerChecks(plan, c, run, values),
  ];
}

/**
 * A capacitive divider in parallel with a resistive one (R1‖C1 from a stepped ideal source to
 * the node, R2‖C2 to ground): the node's voltage one τ after the step, closed form beside sim.
 */
function dividerChecks(
  plan: Plan,
  c: ScenarioCase,
  run: CaseRun,
  values: ReadonlyMap<string, number>,
): ClosedFormCheck[] {
  const out: ClosedFormCheck[] = [];
  const val = (p: Resistor | Capacitor): number => values.get(p.id) ?? p.value;
  for (const { id: net } of plan.nets) {
    const t = touches(plan, net);
    const rs = t.filter((x) => x.part.kind === 'resistor').map((x) => x.part as Resistor);
    const cs = t.filter((x) => x.part.kind === 'capacitor').map((x) => x.part as Capacitor);
    const rest = t.filter((x) => x.part.kind !== 'resistor' && x.part.kind !== 'capacitor');
    if (rs.length !== 2 || cs.length !== 2 || !rest.every((x) => isHighImpedance(x.part, x.pin)))
      continue;
    const r2 = rs.find((r) => other(r, net) === GROUND);
    const c2 = cs.find((x) => other(x, net) === GROUND);
    const r1 = rs.find((r) => r !== r2);
    const c1 = cs.find((x) => x !== c2);
    if (r1 === undefined || r2 === undefined || c1 === undefined || c2 === undefined) continue;
    const top = other(r1, net);
    if (other(c1, net) !== top || (c1.v0 ?? 0) !== 0 || (c2.v0 ?? 0) !== 0) continue;
    const src = plan.parts.find((p) => p.kind === 'vsource' && p.pos === top && p.neg === GROUND);
    if (src?.kind !== 'vsource' || src.role === 'input' || src.wave?.kind !== 'step') continue;
    if (src.rs !== undefined && src.rs > 0) continue;
    const d = capResDividerStep(
      values.get(src.id) ?? src.value,
      val(r1),
      val(c1),
      val(r2),
      val(c2),
    );
    const at = src.wave.t0 + d.tau;
    const wave = netWave(run.sim, net);
    out.push({
      ...check(
        `${r1.id}-${c1.id}-${r2.id}-${c2.id}`,
        `${r1.id}‖${c1.id} over ${r2.id}‖${c2.id} divider: v(${net}) one τ after ${src.id} steps`,
        c,
        capResDividerResponse(d.tau, d),
        wave === undefined ? undefined : valueAt(wave, at),
        `initial ${d.initial} V, final ${d.final} V, τ = ${d.tau} s`,
      ),
      unit: 'V',
    });
  }
  return out;
}
