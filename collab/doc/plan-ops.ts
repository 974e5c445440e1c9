/**
 * Named edits of the plan as a whole: its name, nets, scenarios and settings.
 */
import type * as Y from 'yjs';

import { scenarioSchema, settingsSchema, type ScenarioSpec } from '../engine/plan/plan-schema';
import { partPins } from '../engine/plan/part-pins';
import type { PartSpec } from '../engine/plan/plan-schema-parts';

import {
  collection,
  entryToJson,
  insertEntry,
  META,
  metaMap,
  nextRank,
  settingsMap,
  clone,
  type Json,
} from './doc-layout';
import type { LocalOrigin } from './doc-origin';
import { readParts, readSettings, readSignals } from './doc-to-plan';
import { runEdit, type EditRecord } from './edit-record';
import { assertEntryObject, assertNewId, assertValid, requireEntry } from './edit-validation';
import { PlanEditError } from './plan-edit-error';

/**
 * Renames the plan.
 * @throws PlanEditError when the name is empty.
 */
export function renamePlan(doc: Y.Doc, origin: LocalOrigin, name: string): EditRecord {
  const trimmed = name.trim();
  if (trimmed.length === 0) throw new PlanEditError('plan', 'name', 'must not be empty');
  const before = metaMap(doc).get(META.name);
  return runEdit(
    doc,
    origin,
    {
      op: 'renamePlan',
      target: 'plan',
      targetId: 'name',
      ...(typeof before === 'string' ? { before } : {}),
      after: trimmed,
    },
    () => metaMap(doc).set(META.name, trimmed),
  );
}

/**
 * Adds a net.
 * @throws PlanEditError when the id is taken or is ground (`0`, always present).
 */
export function addNet(
  doc: Y.Doc,
  origin: LocalOrigin,
  net: { id: string; label?: string },
): EditRecord {
  assertEntryObject('nets', net);
  if (net.id === '0') throw new PlanEditError('net', '0', 'ground is always present');
  assertNewId(doc, 'nets', net.id);
  const fields: Record<string, Json> =
    net.label === undefined ? { id: net.id } : { id: net.id, label: net.label };
  return runEdit(
    doc,
    origin,
    { op: 'addNet', target: 'net', targetId: net.id, after: fields },
    () => {
      const map = collection(doc, 'nets');
      insertEntry(map, 'nets', net.id, fields, nextRank(map));
    },
  );
}

/**
 * Removes a net.
 * @throws PlanEditError when it does not exist or a part pin or signal is still on it.
 */
export function removeNet(doc: Y.Doc, origin: LocalOrigin, netId: string): EditRecord {
  const entry = requireEntry(doc, 'nets', netId);
  const users = [
    ...readParts(doc)
      .filter((p: PartSpec) => partPins(p).some((pin) => pin.net === netId))
      .map((p) => `part ${p.id}`),
    ...readSignals(doc)
      .filter((s) => s.net === netId)
      .map((s) => `signal ${s.id}`),
  ];
  if (users.length > 0) throw new PlanEditError('net', netId, `still used by ${users.join(', ')}`);
  const before = { id: netId, ...entryToJson(entry) } as Json;
  return runEdit(doc, origin, { op: 'removeNet', target: 'net', targetId: netId, before }, () =>
    collection(doc, 'nets').delete(netId),
  );
}

/**
 * Adds a scenario (power-up, brown-out…).
 * @throws PlanEditError when the id is taken or the scenario is malformed.
 */
export function addScenario(doc: Y.Doc, origin: LocalOrigin, scenario: ScenarioSpec): EditRecord {
  assertEntryObject('scenarios', scenario);
  assertNewId(doc, 'scenarios', scenario.id);
  const valid = assertValid(scenarioSchema, scenario, 'scenario', scenario.id);
  return runEdit(
    doc,
    origin,
    { op: 'addScenario', target: 'scenario', targetId: valid.id, after: clone(valid) as Json },
    () => {
      const map = collection(doc, 'scenarios');
      insertEntry(map, 'scenarios', valid.id, valid, nextRank(map));
    },
  );
}

/**
 * Removes a scenario.
 * @throws PlanEditError when it does not exist.
 */
export function removeScenario(doc: Y.Doc, origin: LocalOrigin, id: string): EditRecord {
  const before = { id, ...entryToJson(requireEntry(doc, 'scenarios', id)) } as Json;
  return runEdit(
    doc,
    origin,
    { op: 'removeScenario', target: 'scenario', targetId: id, before },
    () => collection(doc, 'scenarios').delete(id),
  );
}

/**
 * Sets (or, with `undefined`, clears back to the default) one plan setting.
 * @throws PlanEditError when the key is unknown or the value is out of range.
 */
export function setSetting(
  doc: Y.Doc,
  origin: LocalOrigin,
  key: string,
  value: Json | undefined,
): EditRecord {
  const current = readSettings(doc) as Record<string, Json>;
  const next: Record<string, unknown> = { ...current, [key]: value };
  if (value === undefined) delete next[key];
  assertValid(settingsSchema, next, 'settings', key);
  const before = current[key];
  return runEdit(
    doc,
    origin,
    {
      op: 'setSetting',
      target: 'settings',
      targetId: key,
      ...(before === undefined ? {} : { before }),
      ...(value === undefined ? {} : { after: value }),
    },
    () => {
      if (value === undefined) settingsMap(doc).delete(key);
      else settingsMap(doc).set(key, clone(value));
    },
  );
}
