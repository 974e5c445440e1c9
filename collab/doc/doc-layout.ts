/**
 * Where a plan lives inside a Y.Doc. Every collection is a Y.Map keyed by a stable id (never an
 * array of positions), so two users adding, editing or removing different entries merge cleanly.
 * Each entry is itself a Y.Map of fields; display order comes from a numeric rank stored in the
 * entry, ties broken by id, so concurrent inserts order the same way on every replica.
 */
import * as Y from 'yjs';

/** Top-level shared types of a plan document. */
export const ROOT = {
  meta: 'meta',
  nets: 'nets',
  parts: 'parts',
  signals: 'signals',
  requirements: 'requirements',
  scenarios: 'scenarios',
  settings: 'settings',
  intents: 'intents',
} as const;

/** The id-keyed collections (everything but `meta` and `settings`). */
export type CollectionName =
  'nets' | 'parts' | 'signals' | 'requirements' | 'scenarios' | 'intents';

/** Keys of the `meta` map. */
export const META = {
  /** Layout version of the document itself (see `doc-schema.ts`). */
  docSchemaVersion: 'docSchemaVersion',
  /** `schemaVersion` of the engine plan JSON the doc converts to. */
  planSchemaVersion: 'planSchemaVersion',
  name: 'name',
  description: 'description',
} as const;

/**
 * Reserved entry key holding the display rank. Plan fields never start with `@`, so it cannot
 * collide with a part or requirement field.
 */
export const RANK_KEY = '@rank';

/** Fields stored as nested Y.Maps so concurrent edits of different sub-keys merge. */
export const NESTED_FIELDS: Readonly<Partial<Record<CollectionName, readonly string[]>>> = {
  parts: ['tolerances'],
  signals: ['thresholds'],
};

/** A plain JSON value as stored in the doc (Yjs keeps these atomically). */
export type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

export type EntryMap = Y.Map<unknown>;

/** The top-level map of a collection. */
export function collection(doc: Y.Doc, name: CollectionName): Y.Map<EntryMap> {
  return doc.getMap<EntryMap>(ROOT[name]);
}

export function metaMap(doc: Y.Doc): Y.Map<unknown> {
  return doc.getMap<unknown>(ROOT.meta);
}

export function settingsMap(doc: Y.Doc): Y.Map<unknown> {
  return doc.getMap<unknown>(ROOT.settings);
}

/** Every top-level type, for undo scopes and observers. */
export function rootTypes(doc: Y.Doc): Y.Map<unknown>[] {
  return Object.values(ROOT).map((name) => doc.getMap<unknown>(name));
}

/** Entries of a collection as `[id, entry]`, in display order (rank, then id). */
export function orderedEntries(map: Y.Map<EntryMap>): Array<[string, EntryMap]> {
  const entries = [...map.entries()].filter((e): e is [string, EntryMap] => e[1] instanceof Y.Map);
  return entries.sort(([ida, a], [idb, b]) => {
    const ra = rankOf(a);
    const rb = rankOf(b);
    if (ra !== rb) return ra - rb;
    return ida < idb ? -1 : ida > idb ? 1 : 0;
  });
}

function rankOf(entry: EntryMap): number {
  const r = entry.get(RANK_KEY);
  return typeof r === 'number' && Number.isFinite(r) ? r : Number.MAX_SAFE_INTEGER;
}

/** The rank for an entry appended after every existing one. */
export function nextRank(map: Y.Map<EntryMap>): number {
  let max = -1;
  for (const entry of map.values()) {
    if (entry instanceof Y.Map) {
      const r = entry.get(RANK_KEY);
      if (typeof r === 'number' && Number.isFinite(r) && r > max) max = r;
    }
  }
  return max + 1;
}

/**
 * A plain object copy of one entry: nested Y.Maps become objects, the rank key is dropped and
 * `undefined` fields are left out.
 */
export function entryToJson(entry: EntryMap): Record<string, Json> {
  const out: Record<string, Json> = {};
  for (const [key, value] of entry.entries()) {
    if (key === RANK_KEY || value === undefined) continue;
    // An emptied nested map (last tolerance cleared) reads as absent, like a never-set field.
    if (value instanceof Y.Map && value.size === 0) continue;
    out[key] = value instanceof Y.Map ? nestedToJson(value) : (value as Json);
  }
  return out;
}

function nestedToJson(map: Y.Map<unknown>): Record<string, Json> {
  const out: Record<string, Json> = {};
  for (const [key, value] of map.entries()) {
    if (value === undefined) continue;
    out[key] = value instanceof Y.Map ? nestedToJson(value) : (value as Json);
  }
  return out;
}

/**
 * Writes `fields` into an (already integrated) entry map, nested fields as Y.Maps. Call inside a
 * transaction.
 */
export function writeEntryFields(
  entry: EntryMap,
  name: CollectionName,
  fields: Readonly<Record<string, unknown>>,
): void {
  const nested = NESTED_FIELDS[name] ?? [];
  for (const [key, value] of Object.entries(fields)) {
    if (key === 'id' || value === undefined) continue;
    if (nested.includes(key) && isPlainObject(value)) {
      const sub = new Y.Map<unknown>();
      entry.set(key, sub);
      for (const [k, v] of Object.entries(value)) if (v !== undefined) sub.set(k, clone(v));
    } else {
      entry.set(key, clone(value));
    }
  }
}

/** Inserts a new entry with the given fields and rank. Call inside a transaction. */
export function insertEntry(
  map: Y.Map<EntryMap>,
  name: CollectionName,
  id: string,
  fields: Readonly<Record<string, unknown>>,
  rank: number,
): EntryMap {
  const entry = new Y.Map<unknown>();
  map.set(id, entry);
  entry.set(RANK_KEY, rank);
  writeEntryFields(entry, name, fields);
  return entry;
}

export function isPlainObject(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === 'object' && !Array.isArray(value);
}

/** Deep copy of a JSON value, so later mutation of the caller's object cannot alias the doc. */
export function clone<T>(value: T): T {
  // JSON round trip rather than structuredClone: the collab tsconfig has neither DOM nor Node types.
  return value === null || typeof value !== 'object'
    ? value
    : (JSON.parse(JSON.stringify(value)) as T);
}
