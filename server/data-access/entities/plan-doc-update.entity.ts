import { Column, Entity, PrimaryColumn } from 'typeorm';

/** One accepted document update, appended before its sender is acknowledged. */
@Entity({ name: 'plan_doc_updates' })
export class PlanDocUpdateEntity {
  @PrimaryColumn({ type: 'uuid', name: 'plan_id' })
  planId: string;

  @PrimaryColumn({ type: 'bigint' })
  seq: string;

  /** Account id of the editing user; null for server-made updates (restore, seed). */
  @Column({ type: 'varchar', length: 64, name: 'author_id', nullable: true })
  authorId: string | null;

  @Column({ type: 'bytea' })
  update: Buffer;

  @Column({ type: 'timestamptz', name: 'created_at', default: () => 'now()' })
  createdAt: Date;
}
