/**
 * Checks an edited entry against the engine's plan schema before anything is written, so a bad
 * value is refused with a message naming the entry and field instead of landing in the shared
 * document for everyone.
 */
import type * as Y from 'yjs';
import type { z } from 'zod';

import { collection, type CollectionName, type EntryMap } from './doc-layout';
import { PlanEditError, type EditTargetKind } from './plan-edit-error';

const TARGET: Readonly<Record<CollectionName, EditTargetKind>> = {
  nets: 'net',
  parts: 'part',
  signals: 'signal',
  requirements: 'requirement',
  scenarios: 'scenario',
  intents: 'intent',
};

/** The target kind of a collection's entries. */
export function targetOf(name: CollectionName): EditTargetKind {
  return TARGET[name];
}

/**
 * Parses `value` with `schema`.
 * @throws PlanEditError with the first issue's field path and message.
 */
export function assertValid<T>(
  schema: z.ZodType<T>,
  value: unknown,
  target: EditTargetKind,
  id: string,
): T {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const field = issue.path.length > 0 ? issue.path.map(String).join('.') : undefined;
  throw new PlanEditError(target, id, issue.message, field);
}

/**
 * The entry with this id.
 * @throws PlanEditError when there is none.
 */
export function requireEntry(doc: Y.Doc, name: CollectionName, id: string): EntryMap {
  const entry = collection(doc, name).get(id);
  if (entry === undefined) throw new PlanEditError(TARGET[name], id, 'no such id in this plan');
  return entry;
}

/**
 * Refuses a non-object where an entry (part, signal, requirement…) is expected, so untyped
 * callers get a message instead of a TypeError.
 * @throws PlanEditError naming the collection.
 */
export function assertEntryObject(
  name: CollectionName,
  value: unknown,
): asserts value is { id: string } {
  if (value === null || typeof value !== 'object' || Array.isArray(value)) {
    throw new PlanEditError(TARGET[name], '?', 'must be an object with an id');
  }
}

/**
 * Refuses an id that is empty, reserved or already used.
 * @throws PlanEditError naming the id.
 */
export function assertNewId(doc: Y.Doc, name: CollectionName, id: string): void {
  if (typeof id !== 'string' || id.trim().length === 0 || id.startsWith('@')) {
    throw new PlanEditError(TARGET[name], String(id), 'id must be non-empty and not start with @');
  }
  if (collection(doc, name).has(id)) {
    throw new PlanEditError(TARGET[name], id, 'id already used in this plan');
  }
}
