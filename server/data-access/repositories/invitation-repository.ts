import { IsNull, type DataSource } from 'typeorm';

import type { Role } from '@rampart/collab/api/accounts';
import { InvitationEntity } from '../entities/invitation.entity';
import { MembershipEntity } from '../entities/membership.entity';

export interface InvitationRecord {
  id: string;
  teamId: string;
  teamName: string;
  email: string;
  role: Role;
  invitedByName: string;
  expiresAt: Date;
  acceptedAt: Date | null;
  revokedAt: Date | null;
}

/** Outcome of redeeming an invitation. */
export type RedeemResult = 'accepted' | 'already_used' | 'already_member';

/** Invitations, looked up by the SHA-256 of their token (the token itself is never stored). */
export class InvitationRepository {
  constructor(private readonly _ds: DataSource) {}

  async create(input: {
    teamId: string;
    email: string;
    role: Role;
    tokenHash: string;
    invitedBy: string;
    expiresAt: Date;
  }): Promise<InvitationRecord> {
    const saved = await this._ds.getRepository(InvitationEntity).save(input);
    const record = await this._find('i.id = $1', saved.id);
    if (!record) throw new Error(`invitation ${saved.id} vanished after insert`);
    return record;
  }

  findByTokenHash(tokenHash: string): Promise<InvitationRecord | null> {
    return this._find('i.token_hash = $1', tokenHash);
  }

  findById(id: string): Promise<InvitationRecord | null> {
    return this._find('i.id = $1', id);
  }

  /** Invitations of a team not yet accepted or revoked (expired ones included), newest first. */
  async listOpen(teamId: string): Promise<InvitationRecord[]> {
    return this._query(
      'i.team_id = $1 AND i.accepted_at IS NULL AND i.revoked_at IS NULL',
      [teamId],
      'ORDER BY i.created_at DESC',
    );
  }

  async revoke(id: string): Promise<void> {
    await this._ds
      .getRepository(InvitationEntity)
      .update({ id, acceptedAt: IsNull(), revokedAt: IsNull() }, { revokedAt: new Date() });
  }

  /**
   * Marks the invitation used and adds the membership in one transaction. The conditional
   * UPDATE makes the token single-use even when two tabs accept at the same moment.
   */
  redeem(id: string, userId: string): Promise<RedeemResult> {
    return this._ds.transaction(async (m) => {
      const invitation = await m.findOneBy(InvitationEntity, { id });
      if (!invitation) return 'already_used';
      const existing = await m.findOneBy(MembershipEntity, { teamId: invitation.teamId, userId });
      if (existing) return 'already_member';
      const used = await m.update(
        InvitationEntity,
        { id, acceptedAt: IsNull(), revokedAt: IsNull() },
        { acceptedAt: new Date(), acceptedBy: userId },
      );
      if (!used.affected) return 'already_used';
      await m.insert(MembershipEntity, {
        teamId: invitation.teamId,
        userId,
        role: invitation.role,
      });
      return 'accepted';
    });
  }

  private async _find(where: string, value: string): Promise<InvitationRecord | null> {
    return (await this._query(where, [value], ''))[0] ?? null;
  }

  private async _query(
    where: string,
    params: unknown[],
    tail: string,
  ): Promise<InvitationRecord[]> {
    const rows: Array<{
      id: string;
      team_id: string;
      team_name: string;
      email: string;
      role: Role;
      invited_by_name: string | null;
      expires_at: Date;
      accepted_at: Date | null;
      revoked_at: Date | null;
    }> = await this._ds.query(
      `SELECT i.id, i.team_id, t.name AS team_name, i.email, i.role, u.name AS invited_by_name,
              i.expires_at, i.accepted_at, i.revoked_at
         FROM invitations i
         JOIN teams t ON t.id = i.team_id
         LEFT JOIN users u ON u.id = i.invited_by
        WHERE ${where} ${tail}`,
      params,
    );
    return rows.map((r) => ({
      id: r.id,
      teamId: r.team_id,
      teamName: r.team_name,
      email: r.email,
      role: r.role,
      invitedByName: r.invited_by_name ?? 'a former member',
      expiresAt: r.expires_at,
      acceptedAt: r.accepted_at,
      revokedAt: r.revoked_at,
    }));
  }
}
