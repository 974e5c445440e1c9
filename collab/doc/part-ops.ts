/**
 * Named edits of parts: add, remove, change the value, another field, or a tolerance. Each is
 * one transaction tagged with the user's origin and an edit record, validated against the
 * engine's part schema first.
 */
import * as Y from 'yjs';

import { partSchema, type PartSpec, type ToleranceSpec } from '../engine/plan/plan-schema-parts';
import { tolerableFields } from '../engine/plan/validate-plan';

import { collection, entryToJson, insertEntry, nextRank, clone, type Json } from './doc-layout';
import type { LocalOrigin } from './doc-origin';
import { runEdit, type EditRecord } from './edit-record';
import { assertEntryObject, assertNewId, assertValid, requireEntry } from './edit-validation';
import { PlanEditError } from './plan-edit-error';

const VALUED = new Set(['resistor', 'capacitor', 'inductor', 'vsource', 'isource']);
const PROTECTED = new Set(['id', 'kind', 'tolerance', 'tolerances']);

function currentPart(doc: Y.Doc, id: string): PartSpec {
  return { id, ...entryToJson(requireEntry(doc, 'parts', id)) } as PartSpec;
}

/**
 * Adds a part at the end of the parts list.
 * @throws PlanEditError when the id is taken or the part does not match the schema.
 */
export function addPart(doc: Y.Doc, origin: LocalOrigin, part: PartSpec): EditRecord {
  assertEntryObject('parts', part);
  assertNewId(doc, 'parts', part.id);
  const valid = assertValid(partSchema, part, 'part', part.id);
  return runEdit(
    doc,
    origin,
    { op: 'addPart', target: 'part', targetId: part.id, after: clone(valid) as Json },
    () => {
      const map = collection(doc, 'parts');
      insertEntry(map, 'parts', part.id, valid, nextRank(map));
    },
  );
}

/**
 * Removes a part. Nets it touched stay (other parts may use them).
 * @throws PlanEditError when the part does not exist.
 */
export function removePart(doc: Y.Doc, origin: LocalOrigin, partId: string): EditRecord {
  const before = currentPart(doc, partId);
  return runEdit(
    doc,
    origin,
    { op: 'removePart', target: 'part', targetId: partId, before: before as unknown as Json },
    () => collection(doc, 'parts').delete(partId),
  );
}

/**
 * Sets the main value of a resistor, capacitor, inductor or source (SI units: Ω, F, H, V, A).
 * @throws PlanEditError when the part has no main value or the value is out of range.
 */
export function setPartValue(
  doc: Y.Doc,
  origin: LocalOrigin,
  partId: string,
  value: number,
): EditRecord {
  const part = currentPart(doc, partId);
  if (!VALUED.has(part.kind)) {
    throw new PlanEditError('part', partId, `a ${part.kind} has no main value`, 'value');
  }
  return setField(doc, origin, part, 'setPartValue', 'value', value);
}

/**
 * Sets (or, with `undefined`, removes) one other field of a part, e.g. a regulator's `softStart`.
 * `id`, `kind` and tolerances have their own ops.
 * @throws PlanEditError when the field is protected or the result does not match the schema.
 */
export function setPartField(
  doc: Y.Doc,
  origin: LocalOrigin,
  partId: string,
  field: string,
  value: Json | undefined,
): EditRecord {
  if (PROTECTED.has(field) || field.startsWith('@')) {
    throw new PlanEditError('part', partId, 'this field cannot be set directly', field);
  }
  return setField(doc, origin, currentPart(doc, partId), 'setPartField', field, value);
}

function setField(
  doc: Y.Doc,
  origin: LocalOrigin,
  part: PartSpec,
  op: 'setPartValue' | 'setPartField',
  field: string,
  value: Json | undefined,
): EditRecord {
  const next: Record<string, unknown> = { ...part, [field]: value };
  if (value === undefined) delete next[field];
  assertValid(partSchema, next, 'part', part.id);
  const before = (part as unknown as Record<string, Json | undefined>)[field];
  return runEdit(
    doc,
    origin,
    {
      op,
      target: 'part',
      targetId: part.id,
      field,
      ...(before === undefined ? {} : { before }),
      ...(value === undefined ? {} : { after: value }),
    },
    () => {
      const entry = requireEntry(doc, 'parts', part.id);
      if (value === undefined) entry.delete(field);
      else entry.set(field, clone(value));
    },
  );
}

/**
 * Sets or clears the tolerance of a part's main value (`field = 'value'`) or of a named numeric
 * field of a behavioural block (e.g. `softStart`, `vout`).
 * @throws PlanEditError when the field cannot be toleranced or the tolerance is malformed.
 */
export function setTolerance(
  doc: Y.Doc,
  origin: LocalOrigin,
  partId: string,
  field: string,
  tolerance: ToleranceSpec | undefined,
): EditRecord {
  const part = currentPart(doc, partId);
  const next: Record<string, unknown> = { ...part };
  let before: ToleranceSpec | undefined;
  if (field === 'value') {
    if (!VALUED.has(part.kind)) {
      throw new PlanEditError('part', partId, `a ${part.kind} has no main value`, 'tolerance');
    }
    before = (part as { tolerance?: ToleranceSpec }).tolerance;
    if (tolerance === undefined) delete next['tolerance'];
    else next['tolerance'] = tolerance;
  } else {
    if (!tolerableFields(part).includes(field)) {
      throw new PlanEditError('part', partId, `${field} is not a toleranced field`, 'tolerances');
    }
    before = part.tolerances?.[field];
    const tols: Record<string, ToleranceSpec> = { ...(part.tolerances ?? {}) };
    if (tolerance === undefined) delete tols[field];
    else tols[field] = tolerance;
    next['tolerances'] = tols;
  }
  assertValid(partSchema, next, 'part', partId);
  const path = field === 'value' ? 'tolerance' : `tolerances.${field}`;
  return runEdit(
    doc,
    origin,
    {
      op: 'setTolerance',
      target: 'part',
      targetId: partId,
      field: path,
      ...(before === undefined ? {} : { before: clone(before) as Json }),
      ...(tolerance === undefined ? {} : { after: clone(tolerance) as Json }),
    },
    () => {
      const entry = requireEntry(doc, 'parts', partId);
      if (field === 'value') {
        if (tolerance === undefined) entry.delete('tolerance');
        else entry.set('tolerance', clone(tolerance));
        return;
      }
      let tols = entry.get('tolerances');
      if (!(tols instanceof Y.Map)) {
        tols = new Y.Map<unknown>();
        entry.set('tolerances', tols);
      }
      const map = tols as Y.Map<unknown>;
      if (tolerance === undefined) map.delete(field);
      else map.set(field, clone(tolerance));
    },
  );
}
