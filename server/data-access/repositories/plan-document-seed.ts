import type { EntityManager } from 'typeorm';
import * as Y from 'yjs';

/** Anything that runs SQL: a DataSource or a transaction's EntityManager. */
type Queryable = Pick<EntityManager, 'query'>;

/**
 * Gives a plan its first document content, once: only when the plan has never stored an
 * update (no state row, or an empty one with an empty log). Seeding twice would merge two
 * independent copies of every item, so a later call is a no-op. Returns whether it seeded.
 */
export async function seedPlanDocument(
  db: Queryable,
  planId: string,
  doc: Y.Doc | Uint8Array,
): Promise<boolean> {
  const state = doc instanceof Y.Doc ? Y.encodeStateAsUpdate(doc) : doc;
  const bytes = Buffer.from(state.buffer, state.byteOffset, state.byteLength);
  const inserted = (await db.query(
    `INSERT INTO "plan_doc_states" ("plan_id", "state") VALUES ($1, $2)
       ON CONFLICT ("plan_id") DO UPDATE SET "state" = EXCLUDED."state", "updated_at" = now()
       WHERE "plan_doc_states"."last_seq" = 0 AND "plan_doc_states"."compacted_seq" = 0
         AND octet_length("plan_doc_states"."state") <= 2
     RETURNING "plan_id"`,
    [planId, bytes],
  )) as unknown[];
  return inserted.length > 0;
}
