import { randomBytes } from 'node:crypto';

import type { DataSource } from 'typeorm';

import type { Role } from '@rampart/collab/api/accounts';
import { ApiClient, linkInMail } from '../../utils/api-client';

/** Password of every user the accounts tests register. */
export const TEST_PASSWORD = 'matrix-password-1';

/** A unique e-mail address for one test. */
export function uniqueEmail(what: string): string {
  return `${what}-${randomBytes(4).toString('hex')}@example.test`;
}

/**
 * Adds a member straight in the database (no sign-in possible: the hash is not bcrypt). For
 * targets of member-changing routes, where each try needs its own fresh member.
 */
export async function insertMember(ds: DataSource, teamId: string, role: Role): Promise<string> {
  const rows: Array<{ id: string }> = await ds.query(
    `INSERT INTO users (email, name, password_hash) VALUES ($1, 'Spare', 'not-a-bcrypt-hash')
     RETURNING id`,
    [uniqueEmail('spare')],
  );
  const id = rows[0]?.id ?? '';
  await ds.query('INSERT INTO memberships (team_id, user_id, role) VALUES ($1, $2, $3)', [
    teamId,
    id,
    role,
  ]);
  return id;
}

/** Owner invites `email` as `role`; resolves the token from the link in the mail. */
export async function inviteAndGetToken(
  owner: ApiClient,
  teamId: string,
  email: string,
  role: Role,
): Promise<{ token: string; invitationId: string }> {
  const res = await owner.post<{ id: string }>(`/api/teams/${teamId}/invitations`, { email, role });
  if (res.status !== 201)
    throw new Error(`invite ${email} → ${res.status} ${JSON.stringify(res.body)}`);
  const link = await linkInMail(owner.baseUrl, email, '/invitations/');
  return { token: new URL(link).pathname.split('/').pop() ?? '', invitationId: res.body.id };
}

/** A team whose owner registered through the API and invited one member per other role. */
export interface TeamFixture {
  teamId: string;
  clients: Record<Role, ApiClient>;
  emails: Record<Role, string>;
  userIds: Record<Role, string>;
}

export async function createTeamWithAllRoles(baseUrl: string, name: string): Promise<TeamFixture> {
  const emails = {
    owner: uniqueEmail('owner'),
    editor: uniqueEmail('editor'),
    reviewer: uniqueEmail('reviewer'),
    viewer: uniqueEmail('viewer'),
  };
  const clients = {
    owner: new ApiClient(baseUrl),
    editor: new ApiClient(baseUrl),
    reviewer: new ApiClient(baseUrl),
    viewer: new ApiClient(baseUrl),
  };
  const userIds = {} as Record<Role, string>;
  userIds.owner = (await clients.owner.register(emails.owner, TEST_PASSWORD, 'Owner')).user.id;
  const team = await clients.owner.post<{ id: string }>('/api/teams', { name });
  if (team.status !== 201) throw new Error(`create team → ${team.status}`);
  for (const role of ['editor', 'reviewer', 'viewer'] as const) {
    userIds[role] = (await clients[role].register(emails[role], TEST_PASSWORD, role)).user.id;
    const { token } = await inviteAndGetToken(clients.owner, team.body.id, emails[role], role);
    const accepted = await clients[role].post(`/api/invitations/${token}/accept`);
    if (accepted.status !== 200) throw new Error(`accept as ${role} → ${accepted.status}`);
  }
  return { teamId: team.body.id, clients, emails, userIds };
}
