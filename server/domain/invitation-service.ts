import type { Role } from '@rampart/collab/api/accounts';
import type {
  InvitationRecord,
  InvitationRepository,
} from '../data-access/repositories/invitation-repository';
import type { MembershipRepository } from '../data-access/repositories/membership-repository';
import type { TeamRepository } from '../data-access/repositories/team-repository';
import type { UserRecord, UserRepository } from '../data-access/repositories/user-repository';
import { AppError } from '../errors/app-error';
import type { Mailer } from '../mail/mailer';
import type { AccessEvents } from './access-events';
import type { AccessService } from './access-service';
import { hashLinkToken, newLinkToken } from './secrets';

export interface InvitationServiceDeps {
  invitations: InvitationRepository;
  memberships: MembershipRepository;
  teams: TeamRepository;
  users: UserRepository;
  access: AccessService;
  events: AccessEvents;
  mailer: Mailer;
  ttlHours: number;
}

/** Invitations by e-mail: single-use links that expire, accepted only by the invited address. */
export class InvitationService {
  constructor(private readonly _d: InvitationServiceDeps) {}

  /** Sends an invitation mail with a link to `<origin>/invitations/<token>`. */
  async invite(
    inviter: UserRecord,
    teamId: string,
    emailInput: string,
    role: Role,
    origin: string,
  ): Promise<InvitationRecord> {
    await this._d.access.assertTeam(inviter.id, teamId, 'team:invite');
    const email = emailInput.toLowerCase();
    const existing = await this._d.users.findCredentialsByEmail(email);
    if (existing && (await this._d.memberships.roleOf(teamId, existing.id))) {
      throw new AppError('conflict', `${email} is already a member of this team`, [
        { path: 'email', message: 'already a member' },
      ]);
    }
    const { token, hash } = newLinkToken();
    const invitation = await this._d.invitations.create({
      teamId,
      email,
      role,
      tokenHash: hash,
      invitedBy: inviter.id,
      expiresAt: new Date(Date.now() + this._d.ttlHours * 3_600_000),
    });
    await this._d.mailer.send({
      to: email,
      subject: `${inviter.name} invited you to ${invitation.teamName} on Rampart`,
      text: [
        `${inviter.name} (${inviter.email}) invited you to join the team`,
        `"${invitation.teamName}" on Rampart as ${role}.`,
        '',
        'Open this link to accept (sign in or register with this address first):',
        '',
        `${origin}/invitations/${token}`,
        '',
        `The link works once and expires on ${invitation.expiresAt.toISOString()}.`,
      ].join('\n'),
    });
    return invitation;
  }

  async listOpen(userId: string, teamId: string): Promise<InvitationRecord[]> {
    await this._d.access.assertTeam(userId, teamId, 'team:invite');
    return this._d.invitations.listOpen(teamId);
  }

  async revoke(userId: string, teamId: string, invitationId: string): Promise<void> {
    await this._d.access.assertTeam(userId, teamId, 'team:invite');
    const invitation = await this._d.invitations.findById(invitationId);
    if (!invitation || invitation.teamId !== teamId) {
      throw new AppError('not_found', 'No such invitation in this team');
    }
    await this._d.invitations.revoke(invitationId);
  }

  /** What a link offers, before accepting it. Anyone holding the token may look. */
  async preview(token: string): Promise<InvitationRecord> {
    return this._usable(token);
  }

  /** Joins the team as the invited role; only for the invited address, once. */
  async accept(user: UserRecord, token: string): Promise<InvitationRecord> {
    const invitation = await this._usable(token);
    if (invitation.email !== user.email.toLowerCase()) {
      throw new AppError(
        'forbidden',
        `This invitation was sent to ${invitation.email}, but you are signed in as ` +
          `${user.email}. Sign out and sign in (or register) as ${invitation.email} to accept it.`,
      );
    }
    const result = await this._d.invitations.redeem(invitation.id, user.id);
    if (result === 'already_member') {
      throw new AppError('conflict', `You are already a member of ${invitation.teamName}`);
    }
    if (result === 'already_used') {
      throw new AppError('conflict', 'This invitation has already been used');
    }
    this._d.events.emit('membershipChanged', user.id, invitation.teamId, invitation.role);
    return invitation;
  }

  private async _usable(token: string): Promise<InvitationRecord> {
    const invitation = await this._d.invitations.findByTokenHash(hashLinkToken(token));
    if (!invitation || invitation.revokedAt) {
      throw new AppError(
        'not_found',
        'This invitation link is not valid (it may have been withdrawn)',
      );
    }
    if (invitation.acceptedAt) {
      throw new AppError('conflict', 'This invitation has already been used');
    }
    if (invitation.expiresAt.getTime() <= Date.now()) {
      throw new AppError(
        'conflict',
        `This invitation expired on ${invitation.expiresAt.toISOString()}; ask a team owner for a new one`,
      );
    }
    return invitation;
  }
}
