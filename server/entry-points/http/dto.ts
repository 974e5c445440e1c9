import type {
  InvitationDto,
  InvitationPreview,
  MeResponse,
  MemberDto,
  PlanSummaryDto,
  TeamDto,
  UserDto,
} from '@rampart/collab/api/accounts';
import type { InvitationRecord } from '../../data-access/repositories/invitation-repository';
import type { MemberRecord } from '../../data-access/repositories/membership-repository';
import type { TeamWithRoleRecord } from '../../data-access/repositories/team-repository';
import type { UserRecord } from '../../data-access/repositories/user-repository';
import type { PlanView } from '../../domain/plan-service';

// Records → the wire contract of `collab/api/accounts.ts`. Nothing else leaves the server.

export const userDto = (u: UserRecord): UserDto => ({ id: u.id, email: u.email, name: u.name });

export const meResponse = (u: UserRecord, teams: TeamWithRoleRecord[]): MeResponse => ({
  user: userDto(u),
  memberships: teams.map((t) => ({ teamId: t.id, teamName: t.name, role: t.role })),
});

export const teamDto = (t: TeamWithRoleRecord): TeamDto => ({
  id: t.id,
  name: t.name,
  role: t.role,
});

export const memberDto = (m: MemberRecord): MemberDto => ({
  userId: m.userId,
  email: m.email,
  name: m.name,
  role: m.role,
  joinedAt: m.joinedAt.toISOString(),
});

export const invitationDto = (i: InvitationRecord): InvitationDto => ({
  id: i.id,
  email: i.email,
  role: i.role,
  invitedBy: i.invitedByName,
  expiresAt: i.expiresAt.toISOString(),
});

export const invitationPreview = (i: InvitationRecord): InvitationPreview => ({
  teamName: i.teamName,
  email: i.email,
  role: i.role,
  invitedBy: i.invitedByName,
  expiresAt: i.expiresAt.toISOString(),
});

export const planDto = (p: PlanView): PlanSummaryDto => ({
  id: p.id,
  slug: p.slug,
  name: p.name,
  teamId: p.teamId,
  role: p.role,
  updatedAt: p.updatedAt.toISOString(),
});
