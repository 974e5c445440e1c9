import { MigrationInterface, QueryRunner } from 'typeorm';

export class CreatePlans1764626400000 implements MigrationInterface {
  name = 'CreatePlans1764626400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE EXTENSION IF NOT EXISTS "pgcrypto"`);
    await q.query(`
      CREATE TABLE "plans" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "slug" varchar(120) NOT NULL UNIQUE,
        "name" varchar(200) NOT NULL,
        "description" text NOT NULL DEFAULT '',
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now()
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "plans"`);
  }
}
