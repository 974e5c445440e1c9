import { Router } from 'express';

import type { Config } from '../../config';
import type { InvitationService } from '../../domain/invitation-service';
import type { TeamService } from '../../domain/team-service';
import { invitationDto, memberDto, teamDto } from './dto';
import { publicOrigin } from './public-origin';
import { changeRoleBody, createTeamBody, idParam, inviteBody, parseBody } from './request-schemas';
import { requireUser, signedInUser } from './session-auth';

export interface TeamsRouterDeps {
  config: Config;
  teams: TeamService;
  invitations: InvitationService;
}

/** `/api/teams/*`: teams, members, roles and a team's invitations. All need a signed-in user. */
export function teamsRouter(d: TeamsRouterDeps): Router {
  const router = Router();
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json((await d.teams.listForUser(signedInUser(req).id)).map(teamDto));
  });

  router.post('/', async (req, res) => {
    const { name } = parseBody(createTeamBody, req);
    res.status(201).json(teamDto(await d.teams.create(signedInUser(req).id, name)));
  });

  router.get('/:teamId', async (req, res) => {
    const team = await d.teams.get(signedInUser(req).id, idParam(req, 'teamId', 'team'));
    res.json(teamDto(team));
  });

  router.get('/:teamId/members', async (req, res) => {
    const members = await d.teams.listMembers(signedInUser(req).id, idParam(req, 'teamId', 'team'));
    res.json(members.map(memberDto));
  });

  router.patch('/:teamId/members/:userId', async (req, res) => {
    const teamId = idParam(req, 'teamId', 'team');
    const memberId = idParam(req, 'userId', 'member in this team');
    const { role } = parseBody(changeRoleBody, req);
    res.json(memberDto(await d.teams.changeRole(signedInUser(req).id, teamId, memberId, role)));
  });

  router.delete('/:teamId/members/:userId', async (req, res) => {
    const teamId = idParam(req, 'teamId', 'team');
    const memberId = idParam(req, 'userId', 'member in this team');
    await d.teams.removeMember(signedInUser(req).id, teamId, memberId);
    res.status(204).end();
  });

  router.get('/:teamId/invitations', async (req, res) => {
    const list = await d.invitations.listOpen(signedInUser(req).id, idParam(req, 'teamId', 'team'));
    res.json(list.map(invitationDto));
  });

  router.post('/:teamId/invitations', async (req, res) => {
    const teamId = idParam(req, 'teamId', 'team');
    const { email, role } = parseBody(inviteBody, req);
    const origin = publicOrigin(d.config, req);
    const invitation = await d.invitations.invite(signedInUser(req), teamId, email, role, origin);
    res.status(201).json(invitationDto(invitation));
  });

  router.delete('/:teamId/invitations/:invitationId', async (req, res) => {
    const teamId = idParam(req, 'teamId', 'team');
    const invitationId = idParam(req, 'invitationId', 'invitation in this team');
    await d.invitations.revoke(signedInUser(req).id, teamId, invitationId);
    res.status(204).end();
  });

  return router;
}
