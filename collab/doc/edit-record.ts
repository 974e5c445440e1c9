/**
 * The audit side of named edits: every op records who changed what (op, target, field, before,
 * after) on its transaction, so an observer or the undo stack can say "Ana set R4 value
 * 100 kΩ → 120 kΩ" without diffing the document.
 */
import type * as Y from 'yjs';

import type { Json } from './doc-layout';
import type { LocalOrigin } from './doc-origin';
import type { EditTargetKind } from './plan-edit-error';
import { formatEngineering } from './engineering-notation';

/** Names of the named operations. */
export type EditOp =
  | 'renamePlan'
  | 'addNet'
  | 'removeNet'
  | 'addPart'
  | 'removePart'
  | 'setPartValue'
  | 'setPartField'
  | 'setTolerance'
  | 'addSignal'
  | 'removeSignal'
  | 'setThreshold'
  | 'setIntent'
  | 'moveRampPoint'
  | 'addRampPoint'
  | 'removeRampPoint'
  | 'addRequirement'
  | 'removeRequirement'
  | 'setRequirementField'
  | 'addScenario'
  | 'removeScenario'
  | 'setSetting';

/** One named edit: who changed what. Plain JSON, safe to log or store. */
export interface EditRecord {
  op: EditOp;
  userId: string;
  userName?: string;
  target: EditTargetKind;
  targetId: string;
  field?: string;
  /** Value before the edit (absent when it did not exist). */
  before?: Json;
  /** Value after the edit (absent when removed). */
  after?: Json;
}

/** Key of the edit record in `transaction.meta`. */
export const EDIT_META_KEY = 'rampart:edit';

/** The edit record a transaction carries, if it was a named op. */
export function editOf(tr: Y.Transaction): EditRecord | undefined {
  const value = tr.meta.get(EDIT_META_KEY);
  return value && typeof value === 'object' ? (value as EditRecord) : undefined;
}

/**
 * Runs `apply` in one transaction tagged with `origin` and the edit record, and returns the
 * record. `apply` must validate before writing: a throw leaves the doc untouched only if
 * nothing was written yet.
 */
export function runEdit(
  doc: Y.Doc,
  origin: LocalOrigin,
  record: Omit<EditRecord, 'userId' | 'userName'>,
  apply: () => void,
): EditRecord {
  const full: EditRecord = {
    ...record,
    userId: origin.userId,
    ...(origin.userName === undefined ? {} : { userName: origin.userName }),
  };
  doc.transact((tr) => {
    tr.meta.set(EDIT_META_KEY, full);
    apply();
  }, origin);
  return full;
}

const UNITS: Readonly<Record<string, string>> = {
  resistor: 'Ω',
  capacitor: 'F',
  inductor: 'H',
  vsource: 'V',
  isource: 'A',
};

/** One line for an audit trail or an undo tooltip. */
export function describeEdit(record: EditRecord, unit?: string): string {
  const who = record.userName ?? record.userId;
  const what = `${record.target} ${record.targetId}${record.field ? ` ${record.field}` : ''}`;
  const show = (v: Json | undefined) => formatValue(v, unit);
  if (record.before === undefined && record.after !== undefined) {
    return record.field ? `${who} set ${what} to ${show(record.after)}` : `${who} added ${what}`;
  }
  if (record.after === undefined) return `${who} removed ${what}`;
  return `${who} changed ${what}: ${show(record.before)} → ${show(record.after)}`;
}

/** Unit symbol of a part kind's main value, for descriptions. */
export function valueUnit(partKind: string): string | undefined {
  return UNITS[partKind];
}

function formatValue(value: Json | undefined, unit: string | undefined): string {
  if (typeof value === 'number') return formatEngineering(value, unit, 4);
  return JSON.stringify(value);
}
