import type { DataSource, EntityManager } from 'typeorm';
import * as Y from 'yjs';

/** One logged update as stored. */
export interface StoredUpdate {
  seq: number;
  update: Uint8Array;
}

/** What loading a plan document returns: compacted state plus the log after it. */
export interface StoredDocument {
  state: Uint8Array;
  compactedSeq: number;
  lastSeq: number;
  updates: StoredUpdate[];
}

/** Where a plan's log stands (for anti-entropy: "is there anything I have not seen?"). */
export interface DocumentHead {
  compactedSeq: number;
  lastSeq: number;
}

/** An update waiting to be appended. */
export interface PendingUpdate {
  update: Uint8Array;
  authorId: string | null;
}

/** Result of one compaction. */
export interface CompactionResult {
  merged: number;
  stateBytes: number;
}

/** The state of an empty Y.Doc: where every plan document starts. */
const EMPTY_STATE = Y.encodeStateAsUpdate(new Y.Doc());

function bytes(value: Buffer | Uint8Array): Uint8Array {
  return new Uint8Array(value.buffer, value.byteOffset, value.byteLength);
}

function param(value: Uint8Array): Buffer {
  return Buffer.from(value.buffer, value.byteOffset, value.byteLength);
}

/**
 * Storage of live plan documents in PostgreSQL: an append-only update log per plan and one
 * compacted state row. Appends of one plan are serialised by the state row's lock, so sequence
 * numbers commit in order even across server processes.
 */
export class PlanDocumentRepository {
  constructor(private readonly dataSource: DataSource) {}

  /** Whether a plan with this id exists in the catalogue. */
  async planExists(planId: string): Promise<boolean> {
    const rows: unknown[] = await this.dataSource.query(`SELECT 1 FROM "plans" WHERE "id" = $1`, [
      planId,
    ]);
    return rows.length > 0;
  }

  /**
   * Loads the compacted state and every later update in one consistent read (REPEATABLE READ,
   * so a concurrent compaction cannot make rows vanish between the two reads). Creates the
   * state row of a plan that has none yet.
   */
  async load(planId: string): Promise<StoredDocument> {
    await this.ensureStateRow(this.dataSource.manager, planId);
    return this.dataSource.transaction('REPEATABLE READ', async (m) => {
      const [head] = (await m.query(
        `SELECT "state", "compacted_seq", "last_seq" FROM "plan_doc_states" WHERE "plan_id" = $1`,
        [planId],
      )) as Array<{ state: Buffer; compacted_seq: string; last_seq: string }>;
      const rows = (await m.query(
        `SELECT "seq", "update" FROM "plan_doc_updates" WHERE "plan_id" = $1 ORDER BY "seq"`,
        [planId],
      )) as Array<{ seq: string; update: Buffer }>;
      return {
        state: bytes(head!.state),
        compactedSeq: Number(head!.compacted_seq),
        lastSeq: Number(head!.last_seq),
        updates: rows.map((r) => ({ seq: Number(r.seq), update: bytes(r.update) })),
      };
    });
  }

  /**
   * Appends updates atomically and returns their sequence numbers, in order. One statement
   * (PostgreSQL runs it as one transaction: the counter bump and the inserts commit together or
   * not at all) so an append costs one round trip and one fsync. Resolves only after COMMIT,
   * so a caller may acknowledge the senders.
   */
  async append(planId: string, items: readonly PendingUpdate[]): Promise<number[]> {
    if (items.length === 0) return [];
    let seqs = await this.appendOnce(planId, items);
    if (seqs === null) {
      await this.ensureStateRow(this.dataSource.manager, planId);
      seqs = await this.appendOnce(planId, items);
    }
    if (seqs === null) throw new Error(`plan ${planId}: no document row to append to`);
    return seqs;
  }

  private async appendOnce(
    planId: string,
    items: readonly PendingUpdate[],
  ): Promise<number[] | null> {
    const rows = (await this.dataSource.query(
      `WITH "counter" AS (
         UPDATE "plan_doc_states" SET "last_seq" = "last_seq" + $2
          WHERE "plan_id" = $1 RETURNING "last_seq")
       INSERT INTO "plan_doc_updates" ("plan_id", "seq", "author_id", "update")
       SELECT $1, "counter"."last_seq" - $2 + "item"."ord", "item"."author", "item"."bytes"
         FROM "counter", unnest($3::varchar[], $4::bytea[]) WITH ORDINALITY
              AS "item"("author", "bytes", "ord")
       RETURNING "seq"`,
      [planId, items.length, items.map((i) => i.authorId), items.map((i) => param(i.update))],
    )) as Array<{ seq: string }>;
    if (rows.length === 0) return null;
    return rows.map((r) => Number(r.seq)).sort((a, b) => a - b);
  }

  /** Where every given plan's log stands, in one query. Plans without a row are absent. */
  async heads(planIds: readonly string[]): Promise<Map<string, DocumentHead>> {
    if (planIds.length === 0) return new Map();
    const rows = (await this.dataSource.query(
      `SELECT "plan_id", "compacted_seq", "last_seq" FROM "plan_doc_states" WHERE "plan_id" = ANY($1::uuid[])`,
      [planIds],
    )) as Array<{ plan_id: string; compacted_seq: string; last_seq: string }>;
    return new Map(
      rows.map((r) => [
        r.plan_id,
        { compactedSeq: Number(r.compacted_seq), lastSeq: Number(r.last_seq) },
      ]),
    );
  }

  /** Updates with `seq > afterSeq` still in the log (compacted ones are in the state). */
  async updatesAfter(planId: string, afterSeq: number): Promise<StoredUpdate[]> {
    const rows = (await this.dataSource.query(
      `SELECT "seq", "update" FROM "plan_doc_updates" WHERE "plan_id" = $1 AND "seq" > $2 ORDER BY "seq"`,
      [planId, afterSeq],
    )) as Array<{ seq: string; update: Buffer }>;
    return rows.map((r) => ({ seq: Number(r.seq), update: bytes(r.update) }));
  }

  /** How many updates and bytes wait in a plan's log. */
  async logSize(planId: string): Promise<{ count: number; bytes: number }> {
    const [row] = (await this.dataSource.query(
      `SELECT count(*)::int AS "count", coalesce(sum(octet_length("update")), 0)::bigint AS "bytes"
         FROM "plan_doc_updates" WHERE "plan_id" = $1`,
      [planId],
    )) as Array<{ count: number; bytes: string }>;
    return { count: row!.count, bytes: Number(row!.bytes) };
  }

  /**
   * Merges the log into the state row and deletes the merged rows, in one transaction holding
   * the state row's lock (appends of this plan wait; nothing can slip between read and delete).
   * Merging goes through a Y.Doc so deleted content is garbage-collected.
   */
  async compact(planId: string): Promise<CompactionResult> {
    return this.dataSource.transaction(async (m) => {
      const [head] = (await m.query(
        `SELECT "state", "last_seq" FROM "plan_doc_states" WHERE "plan_id" = $1 FOR UPDATE`,
        [planId],
      )) as Array<{ state: Buffer; last_seq: string }>;
      if (!head) return { merged: 0, stateBytes: 0 };
      const rows = (await m.query(
        `SELECT "seq", "update" FROM "plan_doc_updates" WHERE "plan_id" = $1 ORDER BY "seq"`,
        [planId],
      )) as Array<{ seq: string; update: Buffer }>;
      if (rows.length === 0) return { merged: 0, stateBytes: head.state.byteLength };
      const doc = new Y.Doc();
      try {
        Y.applyUpdate(doc, bytes(head.state));
        for (const r of rows) Y.applyUpdate(doc, bytes(r.update));
        const state = Y.encodeStateAsUpdate(doc);
        const upTo = Number(rows[rows.length - 1]!.seq);
        await m.query(
          `UPDATE "plan_doc_states" SET "state" = $2, "compacted_seq" = $3, "updated_at" = now() WHERE "plan_id" = $1`,
          [planId, param(state), upTo],
        );
        await m.query(`DELETE FROM "plan_doc_updates" WHERE "plan_id" = $1 AND "seq" <= $2`, [
          planId,
          upTo,
        ]);
        return { merged: rows.length, stateBytes: state.byteLength };
      } finally {
        doc.destroy();
      }
    });
  }

  private async ensureStateRow(m: EntityManager, planId: string): Promise<void> {
    await m.query(
      `INSERT INTO "plan_doc_states" ("plan_id", "state") VALUES ($1, $2) ON CONFLICT DO NOTHING`,
      [planId, param(EMPTY_STATE)],
    );
  }
}
