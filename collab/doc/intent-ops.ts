/**
 * Named edits of drawn intent: set a whole ramp, or drag one point of it. The ramp's own start
 * and end are points `'start'` and `'end'`; breakpoints in between have their own ids.
 */
import type * as Y from 'yjs';

import { collection, type Json } from './doc-layout';
import type { LocalOrigin } from './doc-origin';
import {
  intentPoints,
  intentProblems,
  readIntent,
  writeIntent,
  type DrawnIntent,
} from './drawn-intent';
import { runEdit, type EditRecord } from './edit-record';
import { requireEntry } from './edit-validation';
import { PlanEditError } from './plan-edit-error';

/** A point to move: the ramp start, its end, or a breakpoint id. */
export type RampPointId = 'start' | 'end' | string;

function assertIntent(signalId: string, intent: DrawnIntent): void {
  const problems = intentProblems(signalId, intent);
  if (problems.length > 0) throw new PlanEditError('intent', signalId, problems.join('; '));
}

function intentEntry(doc: Y.Doc, signalId: string) {
  requireEntry(doc, 'signals', signalId);
  const entry = collection(doc, 'intents').get(signalId);
  if (!entry) throw new PlanEditError('intent', signalId, 'no intent drawn for this signal yet');
  return entry;
}

/**
 * Sets the whole drawn intent of a signal.
 * @throws PlanEditError when the signal is unknown or the intent is inconsistent.
 */
export function setIntent(
  doc: Y.Doc,
  origin: LocalOrigin,
  signalId: string,
  intent: DrawnIntent,
): EditRecord {
  requireEntry(doc, 'signals', signalId);
  assertIntent(signalId, intent);
  const existing = collection(doc, 'intents').get(signalId);
  return runEdit(
    doc,
    origin,
    {
      op: 'setIntent',
      target: 'intent',
      targetId: signalId,
      ...(existing ? { before: readIntent(existing) as unknown as Json } : {}),
      after: intent as unknown as Json,
    },
    () => writeIntent(doc, signalId, intent),
  );
}

/**
 * Moves one point of a drawn ramp. `'start'` moves the start time (`v` is ignored: a ramp starts
 * from 0 V), `'end'` the end time and settled level, any other id a breakpoint.
 * @throws PlanEditError when the signal, intent or point is unknown, or the move is inconsistent.
 */
export function moveRampPoint(
  doc: Y.Doc,
  origin: LocalOrigin,
  signalId: string,
  pointId: RampPointId,
  to: { t: number; v: number },
): EditRecord {
  const entry = intentEntry(doc, signalId);
  const current = readIntent(entry);
  const next: DrawnIntent = { ...current, points: current.points.map((p) => ({ ...p })) };
  let before: Json;
  if (pointId === 'start') {
    before = { t: current.start, v: 0 };
    next.start = to.t;
  } else if (pointId === 'end') {
    before = { t: current.end, v: current.level };
    next.end = to.t;
    next.level = to.v;
  } else {
    const point = next.points.find((p) => p.id === pointId);
    if (!point) throw new PlanEditError('intent', signalId, `no point ${pointId}`, 'points');
    before = { t: point.t, v: point.v };
    point.t = to.t;
    point.v = to.v;
  }
  assertIntent(signalId, next);
  return runEdit(
    doc,
    origin,
    {
      op: 'moveRampPoint',
      target: 'intent',
      targetId: signalId,
      field: pointId,
      before,
      after: { t: to.t, v: to.v },
    },
    () => {
      if (pointId === 'start') entry.set('start', to.t);
      else if (pointId === 'end') {
        entry.set('end', to.t);
        entry.set('level', to.v);
      } else intentPoints(entry).set(pointId, { t: to.t, v: to.v });
    },
  );
}

/**
 * Adds a breakpoint to a drawn ramp.
 * @throws PlanEditError when the id is taken or the point is not finite.
 */
export function addRampPoint(
  doc: Y.Doc,
  origin: LocalOrigin,
  signalId: string,
  point: { id: string; t: number; v: number },
): EditRecord {
  const entry = intentEntry(doc, signalId);
  const current = readIntent(entry);
  if (point.id === 'start' || point.id === 'end') {
    throw new PlanEditError('intent', signalId, `"${point.id}" is reserved`, 'points');
  }
  assertIntent(signalId, { ...current, points: [...current.points, point] });
  return runEdit(
    doc,
    origin,
    {
      op: 'addRampPoint',
      target: 'intent',
      targetId: signalId,
      field: point.id,
      after: { t: point.t, v: point.v },
    },
    () => intentPoints(entry).set(point.id, { t: point.t, v: point.v }),
  );
}

/**
 * Removes a breakpoint from a drawn ramp.
 * @throws PlanEditError when the point does not exist.
 */
export function removeRampPoint(
  doc: Y.Doc,
  origin: LocalOrigin,
  signalId: string,
  pointId: string,
): EditRecord {
  const entry = intentEntry(doc, signalId);
  const point = readIntent(entry).points.find((p) => p.id === pointId);
  if (!point) throw new PlanEditError('intent', signalId, `no point ${pointId}`, 'points');
  return runEdit(
    doc,
    origin,
    {
      op: 'removeRampPoint',
      target: 'intent',
      targetId: signalId,
      field: pointId,
      before: { t: point.t, v: point.v },
    },
    () => intentPoints(entry).delete(pointId),
  );
}
