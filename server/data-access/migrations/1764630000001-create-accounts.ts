import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Accounts, teams, roles, invitations, password resets, per-plan role overrides, the session
 * table of connect-pg-simple (created here so migrations own the whole schema) and the team of
 * each plan.
 */
export class CreateAccounts1764630000001 implements MigrationInterface {
  name = 'CreateAccounts1764630000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TYPE "team_role" AS ENUM ('owner', 'editor', 'reviewer', 'viewer')`);
    await q.query(`
      CREATE TABLE "users" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "email" varchar(254) NOT NULL,
        "name" varchar(120) NOT NULL,
        "password_hash" varchar(100) NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "users_email_lower" CHECK ("email" = lower("email"))
      )`);
    await q.query(`CREATE UNIQUE INDEX "users_email_key" ON "users" ("email")`);
    await q.query(`
      CREATE TABLE "teams" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "slug" varchar(120) NOT NULL UNIQUE,
        "name" varchar(120) NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE "memberships" (
        "team_id" uuid NOT NULL REFERENCES "teams" ("id") ON DELETE CASCADE,
        "user_id" uuid NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "role" "team_role" NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY ("team_id", "user_id")
      )`);
    await q.query(`CREATE INDEX "memberships_user_idx" ON "memberships" ("user_id")`);
    await q.query(`
      CREATE TABLE "invitations" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "team_id" uuid NOT NULL REFERENCES "teams" ("id") ON DELETE CASCADE,
        "email" varchar(254) NOT NULL,
        "role" "team_role" NOT NULL,
        "token_hash" char(64) NOT NULL UNIQUE,
        "invited_by" uuid REFERENCES "users" ("id") ON DELETE SET NULL,
        "expires_at" timestamptz NOT NULL,
        "accepted_at" timestamptz,
        "accepted_by" uuid REFERENCES "users" ("id") ON DELETE SET NULL,
        "revoked_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX "invitations_team_idx" ON "invitations" ("team_id")`);
    await q.query(`
      CREATE TABLE "password_reset_tokens" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "user_id" uuid NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "token_hash" char(64) NOT NULL UNIQUE,
        "expires_at" timestamptz NOT NULL,
        "used_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(
      `ALTER TABLE "plans" ADD COLUMN "team_id" uuid REFERENCES "teams" ("id") ON DELETE CASCADE`,
    );
    await q.query(`CREATE INDEX "plans_team_idx" ON "plans" ("team_id")`);
    await q.query(`
      CREATE TABLE "plan_role_overrides" (
        "plan_id" uuid NOT NULL REFERENCES "plans" ("id") ON DELETE CASCADE,
        "user_id" uuid NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "role" "team_role" NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY ("plan_id", "user_id"),
        CONSTRAINT "plan_role_overrides_not_owner" CHECK ("role" <> 'owner')
      )`);
    // The layout connect-pg-simple expects (its table.sql), under our own table name.
    await q.query(`
      CREATE TABLE "sessions" (
        "sid" varchar NOT NULL PRIMARY KEY,
        "sess" json NOT NULL,
        "expire" timestamp(6) NOT NULL
      )`);
    await q.query(`CREATE INDEX "sessions_expire_idx" ON "sessions" ("expire")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "sessions"`);
    await q.query(`DROP TABLE "plan_role_overrides"`);
    await q.query(`ALTER TABLE "plans" DROP COLUMN "team_id"`);
    await q.query(`DROP TABLE "password_reset_tokens"`);
    await q.query(`DROP TABLE "invitations"`);
    await q.query(`DROP TABLE "memberships"`);
    await q.query(`DROP TABLE "teams"`);
    await q.query(`DROP TABLE "users"`);
    await q.query(`DROP TYPE "team_role"`);
  }
}
