import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type {
  ChangeRoleRequest,
  CreateTeamRequest,
  InvitationDto,
  InvitationPreview,
  InviteRequest,
  MemberDto,
  PlanSummaryDto,
  Role,
  TeamDto,
} from '@rampart/collab/api/accounts';

/**
 * Teams, their members, invitations and plan list: one method per API route of
 * `collab/api/accounts.ts`. It holds no state; pages keep what they show in signals, and call
 * `AuthSession.refresh()` when the caller's own memberships change.
 */
@Injectable({ providedIn: 'root' })
export class TeamDirectory {
  private readonly _http = inject(HttpClient);

  /** `GET /api/teams`: the caller's teams. */
  teams(): Observable<TeamDto[]> {
    return this._http.get<TeamDto[]>('/api/teams');
  }

  /** `POST /api/teams`: a new team with the caller as owner. */
  createTeam(name: string): Observable<TeamDto> {
    const body: CreateTeamRequest = { name };
    return this._http.post<TeamDto>('/api/teams', body);
  }

  /** `GET /api/teams/:teamId/members`. */
  members(teamId: string): Observable<MemberDto[]> {
    return this._http.get<MemberDto[]>(`${teamUrl(teamId)}/members`);
  }

  /** `PATCH /api/teams/:teamId/members/:userId` (owners). */
  changeRole(teamId: string, userId: string, role: Role): Observable<MemberDto> {
    const body: ChangeRoleRequest = { role };
    return this._http.patch<MemberDto>(`${memberUrl(teamId, userId)}`, body);
  }

  /** `DELETE /api/teams/:teamId/members/:userId`: removes a member, or leaves when it is you. */
  removeMember(teamId: string, userId: string): Observable<void> {
    return this._http.delete<void>(memberUrl(teamId, userId));
  }

  /** `GET /api/teams/:teamId/invitations`: pending invitations (owners). */
  invitations(teamId: string): Observable<InvitationDto[]> {
    return this._http.get<InvitationDto[]>(`${teamUrl(teamId)}/invitations`);
  }

  /** `POST /api/teams/:teamId/invitations`: sends the invitation e-mail. */
  invite(teamId: string, email: string, role: Role): Observable<InvitationDto> {
    const body: InviteRequest = { email, role };
    return this._http.post<InvitationDto>(`${teamUrl(teamId)}/invitations`, body);
  }

  /** `DELETE /api/teams/:teamId/invitations/:invitationId`: withdraws an open invitation. */
  withdrawInvitation(teamId: string, invitationId: string): Observable<void> {
    return this._http.delete<void>(
      `${teamUrl(teamId)}/invitations/${encodeURIComponent(invitationId)}`,
    );
  }

  /** `GET /api/invitations/:token`: what the invitation offers, readable before signing in. */
  previewInvitation(token: string): Observable<InvitationPreview> {
    return this._http.get<InvitationPreview>(invitationUrl(token));
  }

  /** `POST /api/invitations/:token/accept`: joins the team as the invited address. */
  acceptInvitation(token: string): Observable<TeamDto> {
    return this._http.post<TeamDto>(`${invitationUrl(token)}/accept`, {});
  }

  /** `GET /api/plans`, narrowed to one team. */
  plans(teamId: string): Observable<PlanSummaryDto[]> {
    return this._http
      .get<PlanSummaryDto[]>('/api/plans')
      .pipe(map((plans) => plans.filter((p) => p.teamId === teamId)));
  }
}

function teamUrl(teamId: string): string {
  return `/api/teams/${encodeURIComponent(teamId)}`;
}

function memberUrl(teamId: string, userId: string): string {
  return `${teamUrl(teamId)}/members/${encodeURIComponent(userId)}`;
}

function invitationUrl(token: string): string {
  return `/api/invitations/${encodeURIComponent(token)}`;
}
