/**
 * Named edits of signals and their named thresholds. Removing a signal also removes its drawn
 * intent, and is refused while a requirement still refers to it.
 */
import * as Y from 'yjs';

import { signalSchema, type SignalSpec } from '../engine/plan/plan-schema';

import { collection, entryToJson, insertEntry, nextRank, clone, type Json } from './doc-layout';
import type { LocalOrigin } from './doc-origin';
import { readRequirements } from './doc-to-plan';
import { runEdit, type EditRecord } from './edit-record';
import { assertEntryObject, assertNewId, assertValid, requireEntry } from './edit-validation';
import { PlanEditError } from './plan-edit-error';
import { requirementSignals } from './requirement-ops';

/**
 * Adds a signal at the end of the list.
 * @throws PlanEditError when the id is taken, the net is unknown or the signal is malformed.
 */
export function addSignal(doc: Y.Doc, origin: LocalOrigin, signal: SignalSpec): EditRecord {
  assertEntryObject('signals', signal);
  assertNewId(doc, 'signals', signal.id);
  const valid = assertValid(signalSchema, signal, 'signal', signal.id);
  if (valid.net !== '0' && !collection(doc, 'nets').has(valid.net)) {
    throw new PlanEditError('signal', signal.id, `unknown net ${valid.net}`, 'net');
  }
  return runEdit(
    doc,
    origin,
    { op: 'addSignal', target: 'signal', targetId: signal.id, after: clone(valid) as Json },
    () => {
      const map = collection(doc, 'signals');
      insertEntry(map, 'signals', signal.id, valid, nextRank(map));
    },
  );
}

/**
 * Removes a signal and its drawn intent.
 * @throws PlanEditError when it does not exist or a requirement refers to it.
 */
export function removeSignal(doc: Y.Doc, origin: LocalOrigin, signalId: string): EditRecord {
  const entry = requireEntry(doc, 'signals', signalId);
  const users = readRequirements(doc)
    .filter((r) => requirementSignals(r).includes(signalId))
    .map((r) => r.id);
  if (users.length > 0) {
    throw new PlanEditError('signal', signalId, `still used by requirement ${users.join(', ')}`);
  }
  const before = { id: signalId, ...entryToJson(entry) } as Json;
  return runEdit(
    doc,
    origin,
    { op: 'removeSignal', target: 'signal', targetId: signalId, before },
    () => {
      collection(doc, 'signals').delete(signalId);
      collection(doc, 'intents').delete(signalId);
    },
  );
}

/**
 * Sets (or, with `undefined`, removes) a named threshold of a signal, in volts.
 * @throws PlanEditError when the signal is unknown or the level is not a finite number.
 */
export function setThreshold(
  doc: Y.Doc,
  origin: LocalOrigin,
  signalId: string,
  name: string,
  level: number | undefined,
): EditRecord {
  const entry = requireEntry(doc, 'signals', signalId);
  const current = { id: signalId, ...entryToJson(entry) } as SignalSpec;
  if (name.trim().length === 0) {
    throw new PlanEditError('signal', signalId, 'threshold name must not be empty', 'thresholds');
  }
  const thresholds = { ...(current.thresholds ?? {}) };
  const before = thresholds[name];
  if (level === undefined) delete thresholds[name];
  else thresholds[name] = level;
  assertValid(signalSchema, { ...current, thresholds }, 'signal', signalId);
  return runEdit(
    doc,
    origin,
    {
      op: 'setThreshold',
      target: 'signal',
      targetId: signalId,
      field: `thresholds.${name}`,
      ...(before === undefined ? {} : { before }),
      ...(level === undefined ? {} : { after: level }),
    },
    () => {
      let map = entry.get('thresholds');
      if (!(map instanceof Y.Map)) {
        map = new Y.Map<unknown>();
        entry.set('thresholds', map);
      }
      const t = map as Y.Map<unknown>;
      if (level === undefined) t.delete(name);
      else t.set(name, level);
    },
  );
}
