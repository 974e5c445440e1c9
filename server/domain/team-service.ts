import type { Role } from '@rampart/collab/api/accounts';
import type {
  MemberRecord,
  MembershipRepository,
  OwnerGuardedResult,
} from '../data-access/repositories/membership-repository';
import type {
  TeamRepository,
  TeamWithRoleRecord,
} from '../data-access/repositories/team-repository';
import { AppError } from '../errors/app-error';
import type { AccessEvents } from './access-events';
import type { AccessService } from './access-service';

/** Teams and their members. Every permission comes from the access service (the policy). */
export class TeamService {
  constructor(
    private readonly _teams: TeamRepository,
    private readonly _memberships: MembershipRepository,
    private readonly _access: AccessService,
    private readonly _events: AccessEvents,
  ) {}

  listForUser(userId: string): Promise<TeamWithRoleRecord[]> {
    return this._teams.listForUser(userId);
  }

  /** Any signed-in user may start a team; they become its owner. */
  async create(userId: string, name: string): Promise<TeamWithRoleRecord> {
    const team = await this._teams.createWithOwner(name, userId);
    return { ...team, role: 'owner' };
  }

  async get(userId: string, teamId: string): Promise<TeamWithRoleRecord> {
    const role = await this._access.assertTeam(userId, teamId, 'team:read');
    const team = await this._teams.findById(teamId);
    if (!team) throw new AppError('not_found', 'No such team');
    return { ...team, role };
  }

  async listMembers(userId: string, teamId: string): Promise<MemberRecord[]> {
    await this._access.assertTeam(userId, teamId, 'team:read');
    return this._memberships.listMembers(teamId);
  }

  /** Changes a member's role (owners only); the last owner cannot be demoted. */
  async changeRole(
    userId: string,
    teamId: string,
    memberId: string,
    role: Role,
  ): Promise<MemberRecord> {
    await this._access.assertTeam(userId, teamId, 'team:manage-members');
    const result = await this._memberships.changeRole(teamId, memberId, role);
    assertGuarded(result, 'demoted');
    this._events.emit('membershipChanged', memberId, teamId, role);
    const member = await this._memberships.findMember(teamId, memberId);
    if (!member) throw new AppError('not_found', 'No such member in this team');
    return member;
  }

  /**
   * Removes a member (owners) or leaves the team (`memberId` = the caller, any role). The last
   * owner can do neither: someone must be able to manage the team.
   */
  async removeMember(userId: string, teamId: string, memberId: string): Promise<void> {
    const leaving = memberId === userId;
    await this._access.assertTeam(userId, teamId, leaving ? 'team:leave' : 'team:manage-members');
    const result = await this._memberships.remove(teamId, memberId);
    assertGuarded(result, leaving ? 'leave' : 'removed');
    this._events.emit('membershipChanged', memberId, teamId, null);
  }
}

function assertGuarded(result: OwnerGuardedResult, what: 'demoted' | 'removed' | 'leave'): void {
  if (result === 'not_member') throw new AppError('not_found', 'No such member in this team');
  if (result === 'last_owner') {
    const message =
      what === 'leave'
        ? 'You are the last owner of this team and cannot leave it; make another member an owner first'
        : `The last owner of a team cannot be ${what}; make another member an owner first`;
    throw new AppError('conflict', message);
  }
}
