/**
 * Named edits of requirements, plus which signals a requirement refers to (so removing a signal
 * in use can be refused by name).
 */
import type * as Y from 'yjs';

import { requirementSchema, type RequirementSpec } from '../engine/plan/plan-schema';

import { collection, entryToJson, insertEntry, nextRank, clone, type Json } from './doc-layout';
import type { LocalOrigin } from './doc-origin';
import { runEdit, type EditRecord } from './edit-record';
import { assertEntryObject, assertNewId, assertValid, requireEntry } from './edit-validation';
import { PlanEditError } from './plan-edit-error';

/** Signal ids a requirement names. */
export function requirementSignals(r: RequirementSpec): string[] {
  switch (r.kind) {
    case 'order':
      return [r.a.signal, r.b.signal];
    case 'delay':
      return [r.from.signal, r.to.signal];
    case 'separation':
      return [r.a, ...(r.b ? [r.b] : []), ...[r.from, r.to].flatMap((c) => (c ? [c.signal] : []))];
    case 'back-drive':
      return [r.pin, r.supply];
    case 'monotonic':
    case 'slew':
    case 'settle':
      return [r.signal];
    case 'reset-hold':
      return [r.reset, ...r.rails.map((c) => c.signal)];
  }
}

function assertSignalsExist(doc: Y.Doc, r: RequirementSpec): void {
  const signals = collection(doc, 'signals');
  for (const s of requirementSignals(r)) {
    if (!signals.has(s)) throw new PlanEditError('requirement', r.id, `unknown signal ${s}`);
  }
}

/**
 * Adds a requirement at the end of the list.
 * @throws PlanEditError when the id is taken, a signal is unknown or the shape is wrong.
 */
export function addRequirement(
  doc: Y.Doc,
  origin: LocalOrigin,
  requirement: RequirementSpec,
): EditRecord {
  assertEntryObject('requirements', requirement);
  assertNewId(doc, 'requirements', requirement.id);
  const valid = assertValid(requirementSchema, requirement, 'requirement', requirement.id);
  assertSignalsExist(doc, valid);
  return runEdit(
    doc,
    origin,
    {
      op: 'addRequirement',
      target: 'requirement',
      targetId: valid.id,
      after: clone(valid) as unknown as Json,
    },
    () => {
      const map = collection(doc, 'requirements');
      insertEntry(map, 'requirements', valid.id, valid, nextRank(map));
    },
  );
}

/**
 * Removes a requirement.
 * @throws PlanEditError when it does not exist.
 */
export function removeRequirement(doc: Y.Doc, origin: LocalOrigin, id: string): EditRecord {
  const before = { id, ...entryToJson(requireEntry(doc, 'requirements', id)) } as Json;
  return runEdit(
    doc,
    origin,
    { op: 'removeRequirement', target: 'requirement', targetId: id, before },
    () => collection(doc, 'requirements').delete(id),
  );
}

/**
 * Sets (or, with `undefined`, removes) one field of a requirement, e.g. a delay's `max`.
 * @throws PlanEditError when the requirement is unknown or the result does not match the schema.
 */
export function setRequirementField(
  doc: Y.Doc,
  origin: LocalOrigin,
  id: string,
  field: string,
  value: Json | undefined,
): EditRecord {
  const entry = requireEntry(doc, 'requirements', id);
  if (field === 'id' || field === 'kind' || field.startsWith('@')) {
    throw new PlanEditError('requirement', id, 'this field cannot be set directly', field);
  }
  const current = { id, ...entryToJson(entry) } as Record<string, Json>;
  const next: Record<string, unknown> = { ...current, [field]: value };
  if (value === undefined) delete next[field];
  const valid = assertValid(requirementSchema, next, 'requirement', id);
  assertSignalsExist(doc, valid);
  const before = current[field];
  return runEdit(
    doc,
    origin,
    {
      op: 'setRequirementField',
      target: 'requirement',
      targetId: id,
      field,
      ...(before === undefined ? {} : { before }),
      ...(value === undefined ? {} : { after: value }),
    },
    () => {
      if (value === undefined) entry.delete(field);
      else entry.set(field, clone(value));
    },
  );
}
