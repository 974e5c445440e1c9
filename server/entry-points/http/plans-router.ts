import { Router } from 'express';

import type { PlanService } from '../../domain/plan-service';
import { planDto } from './dto';
import {
  changeRoleBody,
  createPlanBody,
  idParam,
  parseBody,
  renamePlanBody,
} from './request-schemas';
import { requireUser, signedInUser } from './session-auth';
import { AppError } from '../../errors/app-error';
import { OVERRIDE_ROLES } from '../../domain/policy';

/** `/api/plans/*`: the plan catalogue and per-plan role overrides. All need a signed-in user. */
export function plansRouter(d: { plans: PlanService }): Router {
  const router = Router();
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json((await d.plans.list(signedInUser(req).id)).map(planDto));
  });

  router.post('/', async (req, res) => {
    const { teamId, name } = parseBody(createPlanBody, req);
    res.status(201).json(planDto(await d.plans.create(signedInUser(req).id, teamId, name)));
  });

  router.get('/:planId', async (req, res) => {
    res.json(planDto(await d.plans.get(signedInUser(req).id, idParam(req, 'planId', 'plan'))));
  });

  router.patch('/:planId', async (req, res) => {
    const planId = idParam(req, 'planId', 'plan');
    const { name } = parseBody(renamePlanBody, req);
    res.json(planDto(await d.plans.rename(signedInUser(req).id, planId, name)));
  });

  router.delete('/:planId', async (req, res) => {
    await d.plans.delete(signedInUser(req).id, idParam(req, 'planId', 'plan'));
    res.status(204).end();
  });

  router.put('/:planId/roles/:userId', async (req, res) => {
    const planId = idParam(req, 'planId', 'plan');
    const memberId = idParam(req, 'userId', "member in this plan's team");
    const { role } = parseBody(changeRoleBody, req);
    if (!OVERRIDE_ROLES.includes(role)) {
      throw new AppError('validation_failed', 'Invalid request: role cannot be owner on one plan', [
        { path: 'role', message: `must be one of ${OVERRIDE_ROLES.join(', ')}` },
      ]);
    }
    await d.plans.setOverride(signedInUser(req).id, planId, memberId, role);
    res.status(204).end();
  });

  router.delete('/:planId/roles/:userId', async (req, res) => {
    const planId = idParam(req, 'planId', 'plan');
    const memberId = idParam(req, 'userId', "member in this plan's team");
    await d.plans.setOverride(signedInUser(req).id, planId, memberId, null);
    res.status(204).end();
  });

  return router;
}
