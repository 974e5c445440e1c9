import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

import type { Role } from '@rampart/collab/api/accounts';

/** An e-mailed offer to join a team. Only the SHA-256 of the link's token is stored. */
@Entity({ name: 'invitations' })
export class InvitationEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'team_id' })
  teamId: string;

  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ type: 'enum', enumName: 'team_role', enum: ['owner', 'editor', 'reviewer', 'viewer'] })
  role: Role;

  @Column({ type: 'char', length: 64, name: 'token_hash', unique: true })
  tokenHash: string;

  @Column({ type: 'uuid', name: 'invited_by', nullable: true })
  invitedBy: string | null;

  @Column({ type: 'timestamptz', name: 'expires_at' })
  expiresAt: Date;

  @Column({ type: 'timestamptz', name: 'accepted_at', nullable: true })
  acceptedAt: Date | null;

  @Column({ type: 'uuid', name: 'accepted_by', nullable: true })
  acceptedBy: string | null;

  @Column({ type: 'timestamptz', name: 'revoked_at', nullable: true })
  revokedAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
