import {
  Column,
  CreateDateColumn,
  Entity,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';

/**
 * A sequencing plan's catalogue row. The plan's content lives in its collaborative document;
 * this row is what lists, permissions and links refer to. Every column has an explicit type
 * because tsx (esbuild) emits no decorator metadata.
 */
@Entity({ name: 'plans' })
export class PlanEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Stable human-readable key, unique; demo data upserts by it. */
  @Column({ type: 'varchar', length: 120, unique: true })
  slug: string;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ type: 'text', default: '' })
  description: string;

  /** The team whose members may open the plan; null only for rows made before teams existed. */
  @Column({ type: 'uuid', name: 'team_id', nullable: true })
  teamId: string | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
