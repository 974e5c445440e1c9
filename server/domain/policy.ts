/**
 * The permission policy: the only place that decides what a role may do. HTTP routes and the
 * socket relay ask it; nothing else compares roles. Pure functions, no I/O.
 */
import type { Action, Role } from '@rampart/collab/api/accounts';

const PLAN_READERS: readonly Action[] = ['plan:read', 'team:read', 'team:leave'];

/** What each role may do. Owners may do everything. */
const ALLOWED: Record<Role, ReadonlySet<Action>> = {
  owner: new Set<Action>([
    ...PLAN_READERS,
    'plan:create',
    'plan:edit',
    'plan:delete',
    'plan:comment',
    'plan:approve',
    'plan:manage-access',
    'team:manage-members',
    'team:invite',
  ]),
  // Editors author plans; signing off is left to reviewers and owners so that the author of a
  // change is not the one who approves it (common practice, no source).
  editor: new Set<Action>([...PLAN_READERS, 'plan:create', 'plan:edit', 'plan:comment']),
  reviewer: new Set<Action>([...PLAN_READERS, 'plan:comment', 'plan:approve']),
  viewer: new Set<Action>(PLAN_READERS),
};

/**
 * Whether `role` may perform `action`. `null` is "no role here": signed out, or not a member of
 * the team that owns the thing; it may do nothing.
 */
export function can(role: Role | null, action: Action): boolean {
  return role !== null && ALLOWED[role].has(action);
}

/**
 * The role a member has on one plan: the plan's override when there is one, else the team role.
 * Team owners stay owners on every plan (an override never demotes the people who manage the
 * team), overrides never grant `owner`, and without a team role there is no plan role at all.
 */
export function effectivePlanRole(teamRole: Role | null, overrideRole: Role | null): Role | null {
  if (teamRole === null) return null;
  if (teamRole === 'owner') return 'owner';
  if (overrideRole === null || overrideRole === 'owner') return teamRole;
  return overrideRole;
}

/** Roles a per-plan override may set. */
export const OVERRIDE_ROLES: readonly Role[] = ['editor', 'reviewer', 'viewer'];
