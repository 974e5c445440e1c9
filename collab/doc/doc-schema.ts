/**
 * Layout version of a plan document and the path from older layouts to the current one. The
 * version lives inside the doc (`meta.docSchemaVersion`), so every replica and the stored state
 * agree on it; migrations are idempotent, so two replicas migrating at once converge.
 */
import * as Y from 'yjs';

import { collection, META, metaMap, RANK_KEY, type CollectionName } from './doc-layout';
import { PERSISTENCE_ORIGIN, type DocOrigin } from './doc-origin';
import { DocSchemaError } from './plan-edit-error';

/** Layout version written by this code. */
export const DOC_SCHEMA_VERSION = 1;

/** One step of the migration path. */
interface DocMigration {
  from: number;
  to: number;
  /** What the step does, for logs. */
  description: string;
  run(doc: Y.Doc): void;
}

const RANKED: readonly CollectionName[] = ['nets', 'parts', 'signals', 'requirements', 'scenarios'];

/**
 * Steps from each older layout. Version 0 is a doc written before the version field existed:
 * entries may lack a display rank; they get one in id order, which is what such docs showed.
 */
const MIGRATIONS: readonly DocMigration[] = [
  {
    from: 0,
    to: 1,
    description: 'stamp docSchemaVersion; rank unranked entries by id',
    run(doc) {
      for (const name of RANKED) {
        const map = collection(doc, name);
        let next = 0;
        for (const entry of map.values()) {
          const r = entry instanceof Y.Map ? entry.get(RANK_KEY) : undefined;
          if (typeof r === 'number' && r >= next) next = r + 1;
        }
        for (const id of [...map.keys()].sort()) {
          const entry = map.get(id);
          if (entry instanceof Y.Map && typeof entry.get(RANK_KEY) !== 'number') {
            entry.set(RANK_KEY, next++);
          }
        }
      }
    },
  },
];

/** The layout version stored in a doc; 0 when the field is missing. */
export function docSchemaVersion(doc: Y.Doc): number {
  const v = metaMap(doc).get(META.docSchemaVersion);
  return typeof v === 'number' && Number.isInteger(v) && v >= 0 ? v : 0;
}

/** Whether the doc holds no plan at all (a fresh doc before its first sync). */
export function isEmptyPlanDoc(doc: Y.Doc): boolean {
  return metaMap(doc).size === 0 && collection(doc, 'parts').size === 0;
}

/**
 * Throws when this code cannot read the doc: its layout is newer than `DOC_SCHEMA_VERSION`.
 * @throws DocSchemaError naming both versions.
 */
export function assertDocReadable(doc: Y.Doc): void {
  const v = docSchemaVersion(doc);
  if (v > DOC_SCHEMA_VERSION) {
    throw new DocSchemaError(
      `plan document layout ${v} is newer than this version of Rampart understands ` +
        `(${DOC_SCHEMA_VERSION}); reload the page to update`,
    );
  }
}

/** What `migrateDoc` did. */
export interface MigrationReport {
  from: number;
  to: number;
  /** Descriptions of the steps run, oldest first; empty when the doc was current. */
  steps: string[];
}

/**
 * Brings a doc to the current layout in one transaction. An empty doc is left alone (nothing to
 * migrate, and writing to it before its first sync would race the stored state).
 * @throws DocSchemaError when the doc is newer than this code, or no path exists.
 */
export function migrateDoc(doc: Y.Doc, origin: DocOrigin = PERSISTENCE_ORIGIN): MigrationReport {
  assertDocReadable(doc);
  const from = docSchemaVersion(doc);
  if (from === DOC_SCHEMA_VERSION || isEmptyPlanDoc(doc)) {
    return { from, to: from, steps: [] };
  }
  const steps: string[] = [];
  doc.transact(() => {
    let v = from;
    while (v < DOC_SCHEMA_VERSION) {
      const step = MIGRATIONS.find((m) => m.from === v);
      if (!step) throw new DocSchemaError(`no migration from plan document layout ${v}`);
      step.run(doc);
      steps.push(step.description);
      v = step.to;
    }
    metaMap(doc).set(META.docSchemaVersion, v);
  }, origin);
  return { from, to: DOC_SCHEMA_VERSION, steps };
}
