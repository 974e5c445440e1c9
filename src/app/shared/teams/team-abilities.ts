import type { Role } from '@rampart/collab/api/accounts';

/** Which controls of the team page a role sees. */
export interface TeamAbilities {
  /** Invite form and the list of pending invitations. */
  canInvite: boolean;
  /** Role select per member, and the remove button. */
  canManageMembers: boolean;
  /** The "new plan" control (editors and owners create plans). */
  canCreatePlans: boolean;
}

const NONE: TeamAbilities = { canInvite: false, canManageMembers: false, canCreatePlans: false };

/**
 * What to *show* for a role. The server's policy decides what is *allowed* and refuses anything
 * else; this only keeps controls away from people who could not use them (the issue: owners
 * manage members and roles, editors create and edit plans, reviewers and viewers do neither).
 */
export function teamAbilities(role: Role | undefined): TeamAbilities {
  switch (role) {
    case 'owner':
      return { canInvite: true, canManageMembers: true, canCreatePlans: true };
    case 'editor':
      return { ...NONE, canCreatePlans: true };
    case 'reviewer':
    case 'viewer':
    case undefined:
      return NONE;
  }
}

/** Words for a role, for selects and tables. */
export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  editor: 'Editor',
  reviewer: 'Reviewer',
  viewer: 'Viewer',
};

/** One line on what a role may do, shown beside the role select and in the invite form. */
export const ROLE_HINTS: Record<Role, string> = {
  owner: 'Manages members and roles, deletes plans, and edits',
  editor: 'Creates and edits plans',
  reviewer: 'Reads, comments and signs off; no edits',
  viewer: 'Read-only, for trainees',
};
