import type { DataSource } from 'typeorm';

import type { Role } from '@rampart/collab/api/accounts';
import { PlanEntity } from '../entities/plan.entity';
import { PlanRoleOverrideEntity } from '../entities/plan-role-override.entity';

export interface PlanRecord {
  id: string;
  slug: string;
  name: string;
  teamId: string | null;
  updatedAt: Date;
}

/** A plan with what the access decision needs about one user. */
export interface PlanAccessRecord extends PlanRecord {
  teamRole: Role | null;
  overrideRole: Role | null;
}

function toRecord(e: PlanEntity): PlanRecord {
  return { id: e.id, slug: e.slug, name: e.name, teamId: e.teamId, updatedAt: e.updatedAt };
}

/** The plan catalogue and per-plan role overrides. */
export class PlanRepository {
  constructor(private readonly _ds: DataSource) {}

  async findById(id: string): Promise<PlanRecord | null> {
    const e = await this._ds.getRepository(PlanEntity).findOneBy({ id });
    return e ? toRecord(e) : null;
  }

  /** Plans of the teams `userId` belongs to (or one plan), with their team and override roles. */
  async listWithAccess(userId: string, planId?: string): Promise<PlanAccessRecord[]> {
    const rows: Array<{
      id: string;
      slug: string;
      name: string;
      team_id: string | null;
      updated_at: Date;
      team_role: Role | null;
      override_role: Role | null;
    }> = await this._ds.query(
      `SELECT p.id, p.slug, p.name, p.team_id, p.updated_at,
              m.role AS team_role, o.role AS override_role
         FROM plans p
         LEFT JOIN memberships m ON m.team_id = p.team_id AND m.user_id = $1
         LEFT JOIN plan_role_overrides o ON o.plan_id = p.id AND o.user_id = $1
        WHERE ${planId ? 'p.id = $2' : 'm.user_id IS NOT NULL'}
        ORDER BY p.name, p.id`,
      planId ? [userId, planId] : [userId],
    );
    return rows.map((r) => ({
      id: r.id,
      slug: r.slug,
      name: r.name,
      teamId: r.team_id,
      updatedAt: r.updated_at,
      teamRole: r.team_role,
      overrideRole: r.override_role,
    }));
  }

  async create(input: { teamId: string; name: string; slug: string }): Promise<PlanRecord> {
    const e = await this._ds.getRepository(PlanEntity).save(input);
    return toRecord(e);
  }

  async rename(id: string, name: string): Promise<void> {
    await this._ds.getRepository(PlanEntity).update({ id }, { name });
  }

  async delete(id: string): Promise<void> {
    await this._ds.getRepository(PlanEntity).delete({ id });
  }

  async setOverride(planId: string, userId: string, role: Role): Promise<void> {
    await this._ds
      .getRepository(PlanRoleOverrideEntity)
      .upsert({ planId, userId, role }, ['planId', 'userId']);
  }

  async clearOverride(planId: string, userId: string): Promise<void> {
    await this._ds.getRepository(PlanRoleOverrideEntity).delete({ planId, userId });
  }
}
