import * as Y from 'yjs';

/**
 * Makes `target` hold what `source` holds, with the fewest writes: keys absent from `source`
 * are deleted, nested maps are reconciled in place (so concurrent edits elsewhere survive),
 * and a leaf is written only when its value differs. Call inside a transaction on `target`'s
 * doc. Plan documents are maps of maps with JSON leaves (see `collab/doc/doc-layout.ts`);
 * other shared types are copied as JSON.
 */
export function reconcileMap(target: Y.Map<unknown>, source: Y.Map<unknown>): void {
  for (const key of [...target.keys()]) {
    if (!source.has(key)) target.delete(key);
  }
  for (const [key, value] of source.entries()) {
    const current = target.get(key);
    if (value instanceof Y.Map) {
      if (current instanceof Y.Map) {
        reconcileMap(current, value);
      } else {
        target.set(key, new Y.Map<unknown>());
        reconcileMap(target.get(key) as Y.Map<unknown>, value);
      }
      continue;
    }
    const json = value instanceof Y.AbstractType ? (value.toJSON() as unknown) : value;
    if (current instanceof Y.AbstractType || !sameJson(current, json)) {
      target.set(key, json === undefined ? null : structuredCopy(json));
    }
  }
}

function sameJson(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

function structuredCopy(value: unknown): unknown {
  return value === null || typeof value !== 'object' ? value : JSON.parse(JSON.stringify(value));
}
