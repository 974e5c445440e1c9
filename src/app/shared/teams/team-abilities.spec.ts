import { ROLES } from '@rampart/collab/api/accounts';

import { teamAbilities } from './team-abilities';

describe('teamAbilities', () => {
  it('owner → invite, manage members, create plans', () => {
    expect(teamAbilities('owner')).toEqual({
      canInvite: true,
      canManageMembers: true,
      canCreatePlans: true,
    });
  });

  it('editor → create plans only', () => {
    expect(teamAbilities('editor')).toEqual({
      canInvite: false,
      canManageMembers: false,
      canCreatePlans: true,
    });
  });

  it.each(['reviewer', 'viewer', undefined] as const)('%s → no edit controls at all', (role) => {
    expect(Object.values(teamAbilities(role)).some(Boolean)).toBe(false);
  });

  it('every role in the contract → an answer (no role forgotten)', () => {
    for (const role of ROLES) expect(teamAbilities(role)).toBeDefined();
  });
});
