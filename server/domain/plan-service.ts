import { randomBytes } from 'node:crypto';

import type { Role } from '@rampart/collab/api/accounts';
import type { MembershipRepository } from '../data-access/repositories/membership-repository';
import type { PlanRepository } from '../data-access/repositories/plan-repository';
import { AppError } from '../errors/app-error';
import type { AccessEvents } from './access-events';
import type { AccessService } from './access-service';
import { can, effectivePlanRole } from './policy';

/** A plan as one user sees it. */
export interface PlanView {
  id: string;
  slug: string;
  name: string;
  teamId: string;
  role: Role;
  updatedAt: Date;
}

/** The plan catalogue: who sees which plan, creation, renaming, deletion, per-plan roles. */
export class PlanService {
  constructor(
    private readonly _plans: PlanRepository,
    private readonly _memberships: MembershipRepository,
    private readonly _access: AccessService,
    private readonly _events: AccessEvents,
  ) {}

  /** Every plan of the user's teams that their effective role lets them read. */
  async list(userId: string): Promise<PlanView[]> {
    const rows = await this._plans.listWithAccess(userId);
    const views: PlanView[] = [];
    for (const r of rows) {
      const role = effectivePlanRole(r.teamRole, r.overrideRole);
      if (r.teamId && can(role, 'plan:read') && role) {
        views.push({
          id: r.id,
          slug: r.slug,
          name: r.name,
          teamId: r.teamId,
          role,
          updatedAt: r.updatedAt,
        });
      }
    }
    return views;
  }

  async get(userId: string, planId: string): Promise<PlanView> {
    return this._view(await this._access.assertPlan(userId, planId, 'plan:read'));
  }

  async create(userId: string, teamId: string, name: string): Promise<PlanView> {
    const role = await this._access.assertTeam(userId, teamId, 'plan:create');
    const slug = `${slugify(name)}-${randomBytes(4).toString('hex')}`;
    const plan = await this._plans.create({ teamId, name, slug });
    return {
      id: plan.id,
      slug: plan.slug,
      name: plan.name,
      teamId,
      role,
      updatedAt: plan.updatedAt,
    };
  }

  async rename(userId: string, planId: string, name: string): Promise<PlanView> {
    await this._access.assertPlan(userId, planId, 'plan:edit');
    await this._plans.rename(planId, name);
    return this.get(userId, planId);
  }

  async delete(userId: string, planId: string): Promise<void> {
    await this._access.assertPlan(userId, planId, 'plan:delete');
    await this._plans.delete(planId);
  }

  /** Sets (role) or clears (null) a member's override on one plan. */
  async setOverride(
    userId: string,
    planId: string,
    memberId: string,
    role: Role | null,
  ): Promise<void> {
    const { plan } = await this._access.assertPlan(userId, planId, 'plan:manage-access');
    const memberRole = plan.teamId ? await this._memberships.roleOf(plan.teamId, memberId) : null;
    if (!memberRole) throw new AppError('not_found', "No such member in this plan's team");
    if (role === null) await this._plans.clearOverride(planId, memberId);
    else await this._plans.setOverride(planId, memberId, role);
    this._events.emit('planRoleChanged', memberId, planId);
  }

  private _view({
    plan,
    role,
  }: {
    plan: { id: string; slug: string; name: string; teamId: string | null; updatedAt: Date };
    role: Role;
  }): PlanView {
    return {
      id: plan.id,
      slug: plan.slug,
      name: plan.name,
      teamId: plan.teamId ?? '',
      role,
      updatedAt: plan.updatedAt,
    };
  }
}

function slugify(name: string): string {
  const s = name
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80);
  return s || 'plan';
}
