import type { Action, Role } from '@rampart/collab/api/accounts';
import { can, effectivePlanRole } from '../../../server/domain/policy';

// The product's role definitions (issue "Accounts, teams and roles"): owner manages members and
// roles and deletes plans; editor creates and edits plans; reviewer reads, comments and signs
// off but does not edit; viewer only reads. Written out cell by cell, so a change to the policy
// has to change this table too.
const EXPECTED: Record<Action, Role[]> = {
  'plan:read': ['owner', 'editor', 'reviewer', 'viewer'],
  'plan:create': ['owner', 'editor'],
  'plan:edit': ['owner', 'editor'],
  'plan:delete': ['owner'],
  'plan:comment': ['owner', 'editor', 'reviewer'],
  'plan:approve': ['owner', 'reviewer'],
  'plan:manage-access': ['owner'],
  'team:read': ['owner', 'editor', 'reviewer', 'viewer'],
  'team:leave': ['owner', 'editor', 'reviewer', 'viewer'],
  'team:manage-members': ['owner'],
  'team:invite': ['owner'],
};

describe('can(role, action)', () => {
  const roles: Role[] = ['owner', 'editor', 'reviewer', 'viewer'];
  for (const [action, allowed] of Object.entries(EXPECTED) as Array<[Action, Role[]]>) {
    test(`${action} → allowed for exactly ${allowed.join(', ')}`, () => {
      expect(roles.filter((r) => can(r, action))).toEqual(allowed);
    });
  }

  test('no role (signed out or not a member) → nothing at all', () => {
    expect((Object.keys(EXPECTED) as Action[]).filter((a) => can(null, a))).toEqual([]);
  });
});

describe('effectivePlanRole(teamRole, override)', () => {
  test('no override → the team role', () => {
    expect(effectivePlanRole('reviewer', null)).toBe('reviewer');
  });
  test('override → replaces the team role, up or down', () => {
    expect(effectivePlanRole('viewer', 'editor')).toBe('editor');
    expect(effectivePlanRole('editor', 'viewer')).toBe('viewer');
  });
  test('team owner with any override → still owner', () => {
    expect(effectivePlanRole('owner', 'viewer')).toBe('owner');
  });
  test('override owner → ignored (overrides never grant owner)', () => {
    expect(effectivePlanRole('viewer', 'owner')).toBe('viewer');
  });
  test('not a team member, even with an override row → null', () => {
    expect(effectivePlanRole(null, 'editor')).toBeNull();
  });
});
