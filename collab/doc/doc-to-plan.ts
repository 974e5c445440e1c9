/**
 * Plan document → engine plan JSON, and typed read accessors. Pure reads: never writes the doc.
 */
import type * as Y from 'yjs';

import type {
  Plan,
  PlanSettings,
  RequirementSpec,
  ScenarioSpec,
  SignalSpec,
} from '../engine/plan/plan-schema';
import type { PartSpec } from '../engine/plan/plan-schema-parts';
import { PLAN_SCHEMA_VERSION } from '../engine/plan/plan-limits';

import {
  collection,
  entryToJson,
  META,
  metaMap,
  orderedEntries,
  settingsMap,
  type CollectionName,
  type Json,
} from './doc-layout';

type NetSpec = Plan['nets'][number];

function list<T>(doc: Y.Doc, name: CollectionName): T[] {
  return orderedEntries(collection(doc, name)).map(
    ([id, entry]) => ({ id, ...entryToJson(entry) }) as T,
  );
}

/** One entry as JSON with its id, or undefined when the id is unknown. */
export function readEntry<T>(doc: Y.Doc, name: CollectionName, id: string): T | undefined {
  const entry = collection(doc, name).get(id);
  return entry === undefined ? undefined : ({ id, ...entryToJson(entry) } as T);
}

/** Parts in display order. */
export function readParts(doc: Y.Doc): PartSpec[] {
  return list<PartSpec>(doc, 'parts');
}

/** Signals in display order. */
export function readSignals(doc: Y.Doc): SignalSpec[] {
  return list<SignalSpec>(doc, 'signals');
}

/** Requirements in display order. */
export function readRequirements(doc: Y.Doc): RequirementSpec[] {
  return list<RequirementSpec>(doc, 'requirements');
}

/** Nets in display order. */
export function readNets(doc: Y.Doc): NetSpec[] {
  return list<NetSpec>(doc, 'nets');
}

/** Scenarios in display order. */
export function readScenarios(doc: Y.Doc): ScenarioSpec[] {
  return list<ScenarioSpec>(doc, 'scenarios');
}

/** Plan settings as stored (defaults not filled in). */
export function readSettings(doc: Y.Doc): PlanSettings {
  const out: Record<string, Json> = {};
  for (const [key, value] of settingsMap(doc).entries()) {
    if (value !== undefined) out[key] = value as Json;
  }
  return out as PlanSettings;
}

/** The plan's name ('' before the first sync). */
export function readPlanName(doc: Y.Doc): string {
  const name = metaMap(doc).get(META.name);
  return typeof name === 'string' ? name : '';
}

/**
 * The engine plan JSON held by a doc. Not validated here: concurrent edits can leave, say, a
 * requirement naming a removed signal, which the engine's `parsePlan` then reports by name.
 */
export function docToPlan(doc: Y.Doc): Plan {
  const meta = metaMap(doc);
  const version = meta.get(META.planSchemaVersion);
  const description = meta.get(META.description);
  const scenarios = readScenarios(doc);
  const settings = readSettings(doc);
  return {
    schemaVersion: (typeof version === 'number'
      ? version
      : PLAN_SCHEMA_VERSION) as Plan['schemaVersion'],
    name: readPlanName(doc),
    ...(typeof description === 'string' ? { description } : {}),
    nets: readNets(doc),
    parts: readParts(doc),
    signals: readSignals(doc),
    requirements: readRequirements(doc),
    ...(scenarios.length > 0 ? { scenarios } : {}),
    ...(Object.keys(settings).length > 0 ? { settings } : {}),
  };
}
