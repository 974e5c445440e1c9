/**
 * Engine plan JSON → plan document. Pure apart from the Y.Doc it fills: the same plan always
 * yields the same content (not the same Yjs client ids, so only one replica, the server, should
 * seed a plan).
 */
import * as Y from 'yjs';

import type { Plan } from '../engine/plan/plan-schema';

import {
  collection,
  insertEntry,
  META,
  metaMap,
  settingsMap,
  clone,
  type CollectionName,
} from './doc-layout';
import { PERSISTENCE_ORIGIN, type DocOrigin } from './doc-origin';
import { DOC_SCHEMA_VERSION } from './doc-schema';
import { intentProblems, writeIntent, type IntentTable } from './drawn-intent';
import { DocSchemaError } from './plan-edit-error';

/** Options of `planToDoc`. */
export interface PlanToDocOptions {
  /** Drawn intents by signal id. */
  intents?: IntentTable;
  /** Fill this doc instead of a new one; it must be empty. */
  doc?: Y.Doc;
  /** @default PERSISTENCE_ORIGIN */
  origin?: DocOrigin;
}

/**
 * Builds a plan document from engine plan JSON (already validated, e.g. by `parsePlan`).
 * An empty `scenarios` list, `settings` object or nested record (`tolerances`, `thresholds`)
 * reads back as absent: for `settings` and the records that is what the engine assumes anyway.
 * @throws DocSchemaError when ids repeat, an intent names an unknown signal, or `doc` is not empty.
 */
export function planToDoc(plan: Plan, options: PlanToDocOptions = {}): Y.Doc {
  const doc = options.doc ?? new Y.Doc();
  if (metaMap(doc).size > 0) throw new DocSchemaError('planToDoc: the target doc is not empty');
  const intents = options.intents ?? {};
  const signalIds = new Set(plan.signals.map((s) => s.id));
  const problems: string[] = [];
  for (const [id, intent] of Object.entries(intents)) {
    if (!signalIds.has(id)) problems.push(`intent names unknown signal ${id}`);
    problems.push(...intentProblems(id, intent));
  }
  if (problems.length > 0) throw new DocSchemaError(problems.join('; '));
  doc.transact(() => {
    const meta = metaMap(doc);
    meta.set(META.docSchemaVersion, DOC_SCHEMA_VERSION);
    meta.set(META.planSchemaVersion, plan.schemaVersion);
    meta.set(META.name, plan.name);
    if (plan.description !== undefined) meta.set(META.description, plan.description);
    fill(doc, 'nets', plan.nets);
    fill(doc, 'parts', plan.parts);
    fill(doc, 'signals', plan.signals);
    fill(doc, 'requirements', plan.requirements);
    fill(doc, 'scenarios', plan.scenarios ?? []);
    const settings = settingsMap(doc);
    for (const [key, value] of Object.entries(plan.settings ?? {})) {
      if (value !== undefined) settings.set(key, clone(value));
    }
    for (const [id, intent] of Object.entries(intents)) writeIntent(doc, id, intent);
  }, options.origin ?? PERSISTENCE_ORIGIN);
  return doc;
}

function fill(doc: Y.Doc, name: CollectionName, items: ReadonlyArray<{ id: string }>): void {
  const map = collection(doc, name);
  items.forEach((item, rank) => {
    if (map.has(item.id)) throw new DocSchemaError(`${singular(name)} ${item.id}: id used twice`);
    insertEntry(map, name, item.id, item, rank);
  });
}

function singular(name: CollectionName): string {
  return name.replace(/s$/, '');
}
