import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A named version of a plan document. Restoring one appends a forward update. */
@Entity({ name: 'plan_snapshots' })
export class PlanSnapshotEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'plan_id' })
  planId: string;

  @Column({ type: 'varchar', length: 64, name: 'author_id', nullable: true })
  authorId: string | null;

  @Column({ type: 'varchar', length: 500 })
  message: string;

  @Column({ type: 'bytea' })
  state: Buffer;

  @Column({ type: 'varchar', length: 128, name: 'content_hash' })
  contentHash: string;

  /** The plan's last seq when the snapshot was taken. */
  @Column({ type: 'bigint', name: 'at_seq' })
  atSeq: string;

  @Column({ type: 'timestamptz', name: 'created_at', default: () => 'now()' })
  createdAt: Date;
}
