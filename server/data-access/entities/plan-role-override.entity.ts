import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

import type { Role } from '@rampart/collab/api/accounts';

/** A member's role on one plan, replacing their team role there (never `owner`). */
@Entity({ name: 'plan_role_overrides' })
export class PlanRoleOverrideEntity {
  @PrimaryColumn({ type: 'uuid', name: 'plan_id' })
  planId: string;

  @PrimaryColumn({ type: 'uuid', name: 'user_id' })
  userId: string;

  @Column({ type: 'enum', enumName: 'team_role', enum: ['owner', 'editor', 'reviewer', 'viewer'] })
  role: Role;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
