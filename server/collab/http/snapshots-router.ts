import { Router, type Request } from 'express';
import { z } from 'zod';

import type { Action } from '@rampart/collab/api/accounts';
import type { SnapshotDto } from '@rampart/collab/sync/snapshots-api';

import type { SnapshotRecord } from '../../data-access/repositories/plan-snapshot-repository';
import { AppError } from '../../errors/app-error';
import type { SnapshotService } from '../snapshot-service';

/** Resolves when `userId` may do `action` on the plan; throws an `AppError` (404/403) if not. */
export type AssertPlanAccess = (userId: string, planId: string, action: Action) => Promise<unknown>;

const UUID = z.uuid();
const createBody = z.object({ message: z.string().trim().min(1).max(500) });

function dto(s: SnapshotRecord): SnapshotDto {
  return { ...s, createdAt: s.createdAt.toISOString() };
}

function uuidParam(value: unknown, what: string): string {
  if (typeof value === 'string' && UUID.safeParse(value).success) return value;
  throw new AppError('not_found', `No such ${what}`);
}

function userIdOf(req: Request): string {
  const user = req.user as { id?: unknown } | undefined;
  if (!user || typeof user.id !== 'string') throw new AppError('unauthenticated', 'Sign in first');
  return user.id;
}

/**
 * `/api/plans/:planId/snapshots…`: named versions (see `collab/sync/snapshots-api.ts`). Mount
 * behind the session, passport and CSRF middlewares.
 */
export function snapshotsRouter(d: {
  snapshots: SnapshotService;
  assertPlan: AssertPlanAccess;
}): Router {
  const router = Router({ mergeParams: true });

  async function allowed(
    req: Request,
    action: Action,
  ): Promise<{ planId: string; userId: string }> {
    const userId = userIdOf(req);
    const planId = uuidParam(req.params['planId'], 'plan');
    await d.assertPlan(userId, planId, action);
    return { planId, userId };
  }

  router.get('/:planId/snapshots', async (req, res) => {
    const { planId } = await allowed(req, 'plan:read');
    res.json((await d.snapshots.list(planId)).map(dto));
  });

  router.post('/:planId/snapshots', async (req, res) => {
    const { planId, userId } = await allowed(req, 'plan:edit');
    const body = createBody.safeParse(req.body);
    if (!body.success) {
      throw new AppError('validation_failed', 'The snapshot needs a message', [
        { path: 'message', message: 'must be 1 to 500 characters' },
      ]);
    }
    res.status(201).json(dto(await d.snapshots.create(planId, userId, body.data.message)));
  });

  router.post('/:planId/snapshots/:snapshotId/restore', async (req, res) => {
    const { planId, userId } = await allowed(req, 'plan:edit');
    const snapshotId = uuidParam(req.params['snapshotId'], 'snapshot');
    res.json({ seq: await d.snapshots.restore(planId, snapshotId, userId) });
  });

  router.get('/:planId/snapshots/compare', async (req, res) => {
    const { planId } = await allowed(req, 'plan:read');
    const from = uuidParam(req.query['from'], 'snapshot');
    const to = req.query['to'] === 'current' ? 'current' : uuidParam(req.query['to'], 'snapshot');
    const margins = req.query['margins'] === 'nominal';
    res.json({ from, to, diff: await d.snapshots.compare(planId, from, to, margins) });
  });

  return router;
}
