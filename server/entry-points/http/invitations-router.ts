import { Router } from 'express';

import type { InvitationService } from '../../domain/invitation-service';
import type { TeamService } from '../../domain/team-service';
import { invitationPreview, teamDto } from './dto';
import { tokenParam } from './request-schemas';
import { requireUser, signedInUser } from './session-auth';

/**
 * `/api/invitations/:token`: look at an invitation (anyone holding the link), accept it (signed
 * in as the invited address).
 */
export function invitationsRouter(d: {
  invitations: InvitationService;
  teams: TeamService;
}): Router {
  const router = Router();

  router.get('/:token', async (req, res) => {
    const invitation = await d.invitations.preview(tokenParam(req, 'invitation'));
    res.set('Cache-Control', 'no-store').json(invitationPreview(invitation));
  });

  router.post('/:token/accept', requireUser, async (req, res) => {
    const user = signedInUser(req);
    const invitation = await d.invitations.accept(user, tokenParam(req, 'invitation'));
    res.json(teamDto(await d.teams.get(user.id, invitation.teamId)));
  });

  return router;
}
