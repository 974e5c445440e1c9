import type { DataSource, EntityManager } from 'typeorm';

import type { Role } from '@rampart/collab/api/accounts';
import { MembershipEntity } from '../entities/membership.entity';

/** One member of a team, with their user details. */
export interface MemberRecord {
  userId: string;
  email: string;
  name: string;
  role: Role;
  joinedAt: Date;
}

/** Outcome of a change that must keep at least one owner in the team. */
export type OwnerGuardedResult = 'done' | 'not_member' | 'last_owner';

/** Memberships (team × user → role). Changes that could remove the last owner are guarded. */
export class MembershipRepository {
  constructor(private readonly _ds: DataSource) {}

  async roleOf(teamId: string, userId: string): Promise<Role | null> {
    const m = await this._ds.getRepository(MembershipEntity).findOneBy({ teamId, userId });
    return m?.role ?? null;
  }

  async listMembers(teamId: string): Promise<MemberRecord[]> {
    const rows: Array<{
      user_id: string;
      email: string;
      name: string;
      role: Role;
      created_at: Date;
    }> = await this._ds.query(
      `SELECT m.user_id, u.email, u.name, m.role, m.created_at
         FROM memberships m JOIN users u ON u.id = m.user_id
        WHERE m.team_id = $1
        ORDER BY u.name, u.email`,
      [teamId],
    );
    return rows.map((r) => ({
      userId: r.user_id,
      email: r.email,
      name: r.name,
      role: r.role,
      joinedAt: r.created_at,
    }));
  }

  async findMember(teamId: string, userId: string): Promise<MemberRecord | null> {
    const members = await this.listMembers(teamId);
    return members.find((m) => m.userId === userId) ?? null;
  }

  /** Adds a member; false when they already are one. */
  async add(teamId: string, userId: string, role: Role, manager?: EntityManager): Promise<boolean> {
    const result = await (manager ?? this._ds.manager)
      .createQueryBuilder()
      .insert()
      .into(MembershipEntity)
      .values({ teamId, userId, role })
      .orIgnore()
      .returning(['user_id'])
      .execute();
    return (result.raw as unknown[]).length > 0;
  }

  /** Sets a member's role unless that would leave the team without an owner. */
  changeRole(teamId: string, userId: string, role: Role): Promise<OwnerGuardedResult> {
    return this._guarded(teamId, userId, role === 'owner', (m) =>
      m.update(MembershipEntity, { teamId, userId }, { role }).then(() => undefined),
    );
  }

  /** Removes a member unless they are the team's last owner. */
  remove(teamId: string, userId: string): Promise<OwnerGuardedResult> {
    return this._guarded(teamId, userId, false, (m) =>
      m.delete(MembershipEntity, { teamId, userId }).then(() => undefined),
    );
  }

  /**
   * Runs `change` in a transaction holding the team row lock, so two owners demoting each other
   * at once cannot both succeed and leave the team ownerless.
   */
  private _guarded(
    teamId: string,
    userId: string,
    staysOwner: boolean,
    change: (m: EntityManager) => Promise<void>,
  ): Promise<OwnerGuardedResult> {
    return this._ds.transaction(async (m) => {
      await m.query('SELECT id FROM teams WHERE id = $1 FOR UPDATE', [teamId]);
      const current = await m.findOneBy(MembershipEntity, { teamId, userId });
      if (!current) return 'not_member';
      if (current.role === 'owner' && !staysOwner) {
        const owners = await m.countBy(MembershipEntity, { teamId, role: 'owner' });
        if (owners <= 1) return 'last_owner';
      }
      await change(m);
      return 'done';
    });
  }
}
