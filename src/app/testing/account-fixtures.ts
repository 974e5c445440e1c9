import type { MeResponse, MemberDto, Role } from '@rampart/collab/api/accounts';

/** Made-up accounts for client specs (demo data, not real people). */
export const TEAM_ID = 'team-motor-drive';
export const TEAM_NAME = 'Motor-drive controller';

/** `/api/auth/me` for a user with `role` in the motor-drive team (and a second team). */
export function meAs(role: Role, email = `${role}@rampart.test`): MeResponse {
  return {
    user: { id: `user-${role}`, email, name: `${capitalise(role)} Example` },
    memberships: [
      { teamId: TEAM_ID, teamName: TEAM_NAME, role },
      { teamId: 'team-bench', teamName: 'Bench fixtures', role: 'viewer' },
    ],
  };
}

/** One member per role, joined on successive days. */
export function membersOfTeam(): MemberDto[] {
  const roles: Role[] = ['owner', 'editor', 'reviewer', 'viewer'];
  return roles.map((role, i) => ({
    userId: `user-${role}`,
    email: `${role}@rampart.test`,
    name: `${capitalise(role)} Example`,
    role,
    joinedAt: `2026-11-0${i + 1}T09:00:00.000Z`,
  }));
}

/** An API error body as the server sends it. */
export function apiError(
  code: string,
  message: string,
  fields?: Array<{ path: string; message: string }>,
): { error: { code: string; message: string; fields?: Array<{ path: string; message: string }> } } {
  return { error: { code, message, ...(fields ? { fields } : {}) } };
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
