import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

import type { Role } from '@rampart/collab/api/accounts';

/** One person's role in one team. */
@Entity({ name: 'memberships' })
export class MembershipEntity {
  @PrimaryColumn({ type: 'uuid', name: 'team_id' })
  teamId: string;

  @PrimaryColumn({ type: 'uuid', name: 'user_id' })
  userId: string;

  @Column({ type: 'enum', enumName: 'team_role', enum: ['owner', 'editor', 'reviewer', 'viewer'] })
  role: Role;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
