import type { Action, Role } from '@rampart/collab/api/accounts';
import type { MembershipRepository } from '../data-access/repositories/membership-repository';
import type { PlanRecord, PlanRepository } from '../data-access/repositories/plan-repository';
import { AppError } from '../errors/app-error';
import { can, effectivePlanRole } from './policy';

/** A plan and the caller's effective role on it. */
export interface PlanAccess {
  plan: PlanRecord;
  role: Role;
}

/**
 * Looks up roles and asks the policy. Non-members get 404 (a team or plan they may not see does
 * not exist for them); members without the permission get 403.
 */
export class AccessService {
  constructor(
    private readonly _memberships: MembershipRepository,
    private readonly _plans: PlanRepository,
  ) {}

  /** The user's team role, or null when not a member. */
  teamRole(userId: string, teamId: string): Promise<Role | null> {
    return this._memberships.roleOf(teamId, userId);
  }

  /** The plan and the user's effective role on it, or null when they have none (or no plan). */
  async planAccess(userId: string, planId: string): Promise<PlanAccess | null> {
    const [row] = await this._plans.listWithAccess(userId, planId);
    if (!row) return null;
    const role = effectivePlanRole(row.teamRole, row.overrideRole);
    if (role === null) return null;
    const { teamRole: _t, overrideRole: _o, ...plan } = row;
    return { plan, role };
  }

  /** The user's effective role on a plan, or null (what the socket relay asks on join). */
  async effectivePlanRole(userId: string, planId: string): Promise<Role | null> {
    return (await this.planAccess(userId, planId))?.role ?? null;
  }

  /** Resolves the caller's team role when the policy allows `action`, else throws 404/403. */
  async assertTeam(userId: string, teamId: string, action: Action): Promise<Role> {
    const role = await this.teamRole(userId, teamId);
    if (role === null) throw new AppError('not_found', 'No such team');
    if (!can(role, action)) throw forbidden(role, action);
    return role;
  }

  /** Resolves plan and role when the policy allows `action` on the plan, else throws 404/403. */
  async assertPlan(userId: string, planId: string, action: Action): Promise<PlanAccess> {
    const access = await this.planAccess(userId, planId);
    if (!access) throw new AppError('not_found', 'No such plan');
    if (!can(access.role, action)) throw forbidden(access.role, action);
    return access;
  }
}

function forbidden(role: Role, action: Action): AppError {
  return new AppError('forbidden', `Your role (${role}) does not allow ${action}`);
}
