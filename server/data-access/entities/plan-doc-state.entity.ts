import { Column, Entity, PrimaryColumn } from 'typeorm';

/**
 * A plan document's compacted state: every update with `seq <= compactedSeq` merged into one.
 * `lastSeq` is the plan's sequence counter; appends lock this row so seqs commit in order.
 */
@Entity({ name: 'plan_doc_states' })
export class PlanDocStateEntity {
  @PrimaryColumn({ type: 'uuid', name: 'plan_id' })
  planId: string;

  @Column({ type: 'bytea' })
  state: Buffer;

  // bigint comes back from pg as a string; the repositories convert.
  @Column({ type: 'bigint', name: 'compacted_seq', default: 0 })
  compactedSeq: string;

  @Column({ type: 'bigint', name: 'last_seq', default: 0 })
  lastSeq: string;

  @Column({ type: 'timestamptz', name: 'updated_at', default: () => 'now()' })
  updatedAt: Date;
}
