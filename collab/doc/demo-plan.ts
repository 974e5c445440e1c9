/**
 * The demo plan as a document: the engine's motor-drive example plus drawn intent for its main
 * signals. Intent numbers are demo data (a plausible drawing, not a computed result).
 */
import * as Y from 'yjs';

import motorDrive from '../engine/examples/motor-drive.json';
import type { Plan } from '../engine/plan/plan-schema';

import { PERSISTENCE_ORIGIN } from './doc-origin';
import type { IntentTable } from './drawn-intent';
import { planToDoc } from './plan-to-doc';

/** Drawn intent of the demo board: 24 V first, then 5 V, 3.3 V, 1.2 V, reset release. */
export const DEMO_INTENTS: IntentTable = {
  vin: { start: 0, end: 0.001, level: 24, points: [] },
  v5: { start: 0.0008, end: 0.003, level: 5, points: [] },
  en33: { start: 0.0032, end: 0.0075, level: 5, points: [{ id: 'knee', t: 0.005, v: 3.6 }] },
  v33: { start: 0.006, end: 0.0066, level: 3.3, points: [] },
  v12: { start: 0.0072, end: 0.0076, level: 1.2, points: [] },
  rst_n: { start: 0.0105, end: 0.0106, level: 3.3, points: [] },
  vref: { start: 0.0062, end: 0.0065, level: 2.5, points: [] },
};

/** The demo plan JSON (the engine's example file). */
export function demoPlan(): Plan {
  return JSON.parse(JSON.stringify(motorDrive)) as Plan;
}

/**
 * The demo plan document's full state as one update, for seeding storage the first time the
 * demo plan is opened. Seed exactly once (one replica): seeding twice would merge two copies.
 */
export function demoPlanUpdate(): Uint8Array {
  const doc = planToDoc(demoPlan(), { intents: DEMO_INTENTS, origin: PERSISTENCE_ORIGIN });
  const update = Y.encodeStateAsUpdate(doc);
  doc.destroy();
  return update;
}
