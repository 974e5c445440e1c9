/**
 * What changed between two plans (two snapshots): parts, signals, nets, requirements and
 * scenarios added, removed or changed field by field; settings; and the margins of each
 * requirement when analysis results are given.
 */
import type { Plan } from '../engine/plan/plan-schema';

import { canonicalJson } from './content-hash';

/** One changed field, by dotted path inside its entry (`tolerance.percent`). */
export interface FieldChange {
  path: string;
  /** Absent when the field did not exist before. */
  before?: unknown;
  /** Absent when the field was removed. */
  after?: unknown;
}

/** One entry that was added, removed or changed. */
export interface EntryChange {
  id: string;
  change: 'added' | 'removed' | 'changed';
  /** Field changes (for `changed`; empty otherwise). */
  fields: FieldChange[];
}

/** Margin of one requirement in each plan's analysis (null: not measured). */
export interface MarginChange {
  requirementId: string;
  before: number | null;
  after: number | null;
  /** after − before, when both are numbers. */
  delta: number | null;
}

/** Margins by requirement id, e.g. the worst-case margin of each requirement. */
export type MarginTable = Readonly<Record<string, number | null>>;

export interface PlanDiff {
  name?: FieldChange;
  nets: EntryChange[];
  parts: EntryChange[];
  signals: EntryChange[];
  requirements: EntryChange[];
  scenarios: EntryChange[];
  settings: FieldChange[];
  margins: MarginChange[];
  /** Whether nothing at all changed (margins included). */
  same: boolean;
}

/** Options of `diffPlans`. */
export interface DiffOptions {
  marginsBefore?: MarginTable;
  marginsAfter?: MarginTable;
}

/** Compares plan `a` (before) with plan `b` (after). */
export function diffPlans(a: Plan, b: Plan, options: DiffOptions = {}): PlanDiff {
  const diff: PlanDiff = {
    nets: diffLists(a.nets, b.nets),
    parts: diffLists(a.parts, b.parts),
    signals: diffLists(a.signals, b.signals),
    requirements: diffLists(a.requirements, b.requirements),
    scenarios: diffLists(a.scenarios ?? [], b.scenarios ?? []),
    settings: diffObjects(a.settings ?? {}, b.settings ?? {}, ''),
    margins: diffMargins(options.marginsBefore ?? {}, options.marginsAfter ?? {}),
    same: false,
  };
  if (a.name !== b.name) diff.name = { path: 'name', before: a.name, after: b.name };
  diff.same =
    diff.name === undefined &&
    [diff.nets, diff.parts, diff.signals, diff.requirements, diff.scenarios].every(
      (l) => l.length === 0,
    ) &&
    diff.settings.length === 0 &&
    diff.margins.length === 0;
  return diff;
}

function diffLists<T extends { id: string }>(a: readonly T[], b: readonly T[]): EntryChange[] {
  const before = new Map(a.map((e) => [e.id, e]));
  const after = new Map(b.map((e) => [e.id, e]));
  const out: EntryChange[] = [];
  for (const [id, entry] of before) {
    const next = after.get(id);
    if (next === undefined) out.push({ id, change: 'removed', fields: [] });
    else {
      const fields = diffObjects(
        entry as unknown as Record<string, unknown>,
        next as unknown as Record<string, unknown>,
        '',
      );
      if (fields.length > 0) out.push({ id, change: 'changed', fields });
    }
  }
  for (const id of after.keys()) {
    if (!before.has(id)) out.push({ id, change: 'added', fields: [] });
  }
  return out;
}

function isObject(v: unknown): v is Record<string, unknown> {
  return v !== null && typeof v === 'object' && !Array.isArray(v);
}

/** Field-level differences; nested objects recurse, arrays compare as a whole. */
function diffObjects(
  a: Readonly<Record<string, unknown>>,
  b: Readonly<Record<string, unknown>>,
  prefix: string,
): FieldChange[] {
  const out: FieldChange[] = [];
  const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
  for (const key of keys) {
    const path = prefix ? `${prefix}.${key}` : key;
    const va = a[key];
    const vb = b[key];
    if (va === undefined && vb === undefined) continue;
    if (isObject(va) && isObject(vb)) {
      out.push(...diffObjects(va, vb, path));
      continue;
    }
    if (va !== undefined && vb !== undefined && canonicalJson(va) === canonicalJson(vb)) continue;
    out.push({
      path,
      ...(va === undefined ? {} : { before: va }),
      ...(vb === undefined ? {} : { after: vb }),
    });
  }
  return out;
}

function diffMargins(a: MarginTable, b: MarginTable): MarginChange[] {
  const ids = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
  const out: MarginChange[] = [];
  for (const id of ids) {
    const before = a[id] ?? null;
    const after = b[id] ?? null;
    if (before === after) continue;
    out.push({
      requirementId: id,
      before,
      after,
      delta: before !== null && after !== null ? after - before : null,
    });
  }
  return out;
}
