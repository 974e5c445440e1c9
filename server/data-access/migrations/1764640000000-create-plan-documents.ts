import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Storage of live plan documents: the compacted state per plan, the append-only log of updates
 * since, named snapshots, and the table the socket.io PostgreSQL adapter uses for large packets.
 */
export class CreatePlanDocuments1764640000000 implements MigrationInterface {
  name = 'CreatePlanDocuments1764640000000';

  async up(q: QueryRunner): Promise<void> {
    // One row per plan once its document exists. `last_seq` is the per-plan sequence counter
    // (appends lock this row, so sequence numbers commit in order); `state` holds every update
    // with seq <= `compacted_seq`.
    await q.query(`
      CREATE TABLE "plan_doc_states" (
        "plan_id" uuid PRIMARY KEY REFERENCES "plans"("id") ON DELETE CASCADE,
        "state" bytea NOT NULL,
        "compacted_seq" bigint NOT NULL DEFAULT 0,
        "last_seq" bigint NOT NULL DEFAULT 0,
        "updated_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE "plan_doc_updates" (
        "plan_id" uuid NOT NULL REFERENCES "plan_doc_states"("plan_id") ON DELETE CASCADE,
        "seq" bigint NOT NULL,
        "author_id" varchar(64),
        "update" bytea NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY ("plan_id", "seq")
      )`);
    await q.query(`
      CREATE TABLE "plan_snapshots" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "plan_id" uuid NOT NULL REFERENCES "plans"("id") ON DELETE CASCADE,
        "author_id" varchar(64),
        "message" varchar(500) NOT NULL,
        "state" bytea NOT NULL,
        "content_hash" varchar(128) NOT NULL,
        "at_seq" bigint NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(
      `CREATE INDEX "plan_snapshots_plan_created" ON "plan_snapshots" ("plan_id", "created_at")`,
    );
    // Shape required by @socket.io/postgres-adapter (packets above its payload threshold).
    await q.query(`
      CREATE TABLE IF NOT EXISTS "socket_io_attachments" (
        "id" bigserial UNIQUE,
        "created_at" timestamptz DEFAULT now(),
        "payload" bytea
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "socket_io_attachments"`);
    await q.query(`DROP TABLE "plan_snapshots"`);
    await q.query(`DROP TABLE "plan_doc_updates"`);
    await q.query(`DROP TABLE "plan_doc_states"`);
  }
}
