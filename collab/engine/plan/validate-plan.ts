/**
 * Parses untrusted JSON into a `Plan`: zod for shapes, then cross-reference checks (unknown nets,
 * duplicate ids, toleranced fields, signal references) and the network's topology. Every message
 * names the part, net, signal or field at fault.
 */
import type { z } from 'zod';
import { GROUND } from '../netlist';
import { LIMITS } from './plan-limits';
import { PlanError } from './plan-errors';
import { planSchema, type CrossingRef, type Plan, type RequirementSpec } from './plan-schema';
import type { PartSpec } from './plan-schema-parts';
import { partPins } from './part-pins';
import { topologyProblems } from './topology-checks';

/** Numeric fields of a part that a `tolerances` entry may vary. */
export function tolerableFields(part: PartSpec): string[] {
  const skip = new Set(['value', 'v0', 'i0']);
  const fields = Object.entries(part)
    .filter(([key, v]) => typeof v === 'number' && !skip.has(key))
    .map(([key]) => key);
  if (part.kind === 'supervisor') fields.push('threshold');
  if (part.kind === 'diode') fields.push(...Object.keys(part.model).filter((k) => k !== 'kind'));
  return fields;
}

function describeIssuePath(input: unknown, path: ReadonlyArray<PropertyKey>): string {
  const out: string[] = [];
  let node: unknown = input;
  for (const key of path) {
    const next =
      node !== null && typeof node === 'object'
        ? (node as Record<PropertyKey, unknown>)[key]
        : undefined;
    const id =
      next !== null && typeof next === 'object' ? (next as { id?: unknown }).id : undefined;
    if (typeof key === 'number') out.push(typeof id === 'string' ? `[${key}] (${id})` : `[${key}]`);
    else out.push(out.length === 0 ? String(key) : `.${String(key)}`);
    node = next;
  }
  return out.join('') || 'plan';
}

function zodProblems(input: unknown, error: z.ZodError): string[] {
  return error.issues.map((issue) => `${describeIssuePath(input, issue.path)}: ${issue.message}`);
}

function duplicates(kind: string, ids: readonly string[]): string[] {
  const seen = new Set<string>();
  const problems: string[] = [];
  for (const id of ids) {
    if (seen.has(id)) problems.push(`${kind} ${id}: id used more than once`);
    seen.add(id);
  }
  return problems;
}

function partProblems(plan: Plan, nets: ReadonlySet<string>): string[] {
  const problems: string[] = [];
  for (const part of plan.parts) {
    for (const { pin, net } of partPins(part)) {
      if (!nets.has(net)) problems.push(`part ${part.id}: pin ${pin} uses unknown net ${net}`);
    }
    const fields = tolerableFields(part);
    for (const key of Object.keys(part.tolerances ?? {})) {
      if (!fields.includes(key)) {
        problems.push(
          `part ${part.id}: tolerances.${key} is not a numeric field of a ${part.kind} (use one of ${fields.join(', ') || 'none'})`,
        );
      }
    }
    const tol = 'tolerance' in part ? part.tolerance : undefined;
    if (tol?.min !== undefined && tol.max !== undefined && 'value' in part) {
      if (!(tol.min <= part.value && part.value <= tol.max)) {
        problems.push(
          `part ${part.id}: tolerance min ${tol.min} and max ${tol.max} must bracket the value ${part.value}`,
        );
      }
      if (
        (part.kind === 'resistor' || part.kind === 'capacitor' || part.kind === 'inductor') &&
        tol.min <= 0
      ) {
        problems.push(`part ${part.id}: tolerance min must be > 0 for a ${part.kind}`);
      }
    }
    if (part.kind === 'regulator' && part.enOff > part.enOn) {
      problems.push(`part ${part.id}: enOff (${part.enOff} V) must be ≤ enOn (${part.enOn} V)`);
    }
    if (part.kind === 'regulator' && part.pg !== undefined && part.pgThreshold === undefined) {
      problems.push(`part ${part.id}: pg net given without pgThreshold`);
    }
    if ((part.kind === 'vsource' || part.kind === 'isource') && part.wave?.kind === 'pwl') {
      const times = part.wave.points.map((p) => p[0]);
      if (times.some((t, i) => i > 0 && t <= times[i - 1])) {
        problems.push(`part ${part.id}: pwl times must be strictly increasing`);
      }
    }
  }
  return problems;
}

function levelProblem(
  plan: Plan,
  where: string,
  signalId: string,
  level: string | number,
): string | undefined {
  const signal = plan.signals.find((s) => s.id === signalId);
  if (signal === undefined) return `${where}: unknown signal ${signalId}`;
  if (typeof level === 'string' && signal.thresholds?.[level] === undefined) {
    return `${where}: signal ${signalId} has no threshold named ${level}`;
  }
  return undefined;
}

function requirementRefs(req: RequirementSpec): Array<{ signal: string; level?: string | number }> {
  const c = (r: CrossingRef) => ({ signal: r.signal, level: r.level });
  switch (req.kind) {
    case 'order':
      return [c(req.a), c(req.b)];
    case 'delay':
      return [c(req.from), c(req.to)];
    case 'separation':
      return [
        { signal: req.a },
        ...(req.b === undefined ? [] : [{ signal: req.b }]),
        ...(req.from === undefined ? [] : [c(req.from)]),
        ...(req.to === undefined ? [] : [c(req.to)]),
      ];
    case 'back-drive':
      return [{ signal: req.pin }, { signal: req.supply }];
    case 'monotonic':
    case 'slew':
      return [
        { signal: req.signal },
        ...(req.from === undefined ? [] : [{ signal: req.signal, level: req.from }]),
        ...(req.to === undefined ? [] : [{ signal: req.signal, level: req.to }]),
      ];
    case 'settle':
      return [{ signal: req.signal }];
    case 'reset-hold':
      return [{ signal: req.reset, level: req.release }, ...req.rails.map(c)];
  }
}

function signalProblems(plan: Plan, nets: ReadonlySet<string>): string[] {
  const problems: string[] = [];
  for (const s of plan.signals) {
    if (!nets.has(s.net)) problems.push(`signal ${s.id}: unknown net ${s.net}`);
  }
  for (const req of plan.requirements) {
    for (const ref of requirementRefs(req)) {
      const p = levelProblem(plan, `requirement ${req.id}`, ref.signal, ref.level ?? 0);
      if (p !== undefined) problems.push(p);
    }
    if (req.kind === 'delay' && req.min === undefined && req.max === undefined) {
      problems.push(`requirement ${req.id}: delay needs min, max or both`);
    }
    if (
      req.kind === 'delay' &&
      req.min !== undefined &&
      req.max !== undefined &&
      req.min > req.max
    ) {
      problems.push(`requirement ${req.id}: delay min must be ≤ max`);
    }
    if (req.kind === 'slew' && req.min === undefined && req.max === undefined) {
      problems.push(`requirement ${req.id}: slew needs min, max or both`);
    }
  }
  return problems;
}

/**
 * Validates untrusted input as a plan.
 * @throws PlanError listing every problem found, each naming its part, net or field.
 */
export function parsePlan(input: unknown): Plan {
  const parsed = planSchema.safeParse(input);
  if (!parsed.success) throw new PlanError(zodProblems(input, parsed.error));
  const plan = parsed.data;
  const problems: string[] = [];
  if (plan.parts.length > LIMITS.maxParts)
    problems.push(`plan has ${plan.parts.length} parts; the limit is ${LIMITS.maxParts}`);
  if (plan.nets.length > LIMITS.maxNets)
    problems.push(`plan has ${plan.nets.length} nets; the limit is ${LIMITS.maxNets}`);
  problems.push(
    ...duplicates(
      'net',
      plan.nets.map((n) => n.id),
    ),
  );
  problems.push(
    ...duplicates(
      'part',
      plan.parts.map((p) => p.id),
    ),
  );
  problems.push(
    ...duplicates(
      'signal',
      plan.signals.map((s) => s.id),
    ),
  );
  problems.push(
    ...duplicates(
      'requirement',
      plan.requirements.map((r) => r.id),
    ),
  );
  problems.push(
    ...duplicates(
      'scenario',
      (plan.scenarios ?? []).map((s) => s.id),
    ),
  );
  const nets = new Set([GROUND, ...plan.nets.map((n) => n.id)]);
  problems.push(...partProblems(plan, nets));
  problems.push(...signalProblems(plan, nets));
  if (problems.length === 0) problems.push(...topologyProblems(plan.parts));
  if (problems.length > 0) throw new PlanError(problems);
  return plan;
}
