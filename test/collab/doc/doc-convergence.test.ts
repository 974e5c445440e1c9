import * as Y from 'yjs';

import { contentHash } from '@rampart/collab/doc/content-hash';
import { docToPlan } from '@rampart/collab/doc/doc-to-plan';
import { readIntents } from '@rampart/collab/doc/drawn-intent';
import { localOrigin, REMOTE_ORIGIN, type LocalOrigin } from '@rampart/collab/doc/doc-origin';
import { moveRampPoint } from '@rampart/collab/doc/intent-ops';
import { addPart, removePart, setPartValue, setTolerance } from '@rampart/collab/doc/part-ops';
import { PlanEditError } from '@rampart/collab/doc/plan-edit-error';
import { createPlanUndo, type PlanUndo } from '@rampart/collab/doc/plan-undo';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';
import { setThreshold } from '@rampart/collab/doc/signal-ops';

import { seededRandom } from '../../utils/seeded-random';
import { smallIntents, smallPlan } from './fixtures';

interface Replica {
  doc: Y.Doc;
  origin: LocalOrigin;
  undo: PlanUndo;
  outbox: Uint8Array[];
}

/**
 * Replicas edit with named ops (and undo) while updates travel in random order with random
 * delays; after delivering everything every replica must hold the same plan.
 */
describe('plan document convergence', () => {
  test('6 replicas × 300 random ops, shuffled delivery (seed 20261201) → identical plans', () => {
    const rand = seededRandom(20261201);
    const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rand() * xs.length)];
    const seed = Y.encodeStateAsUpdate(planToDoc(smallPlan(), { intents: smallIntents() }));
    const replicas: Replica[] = Array.from({ length: 6 }, (_, i) => {
      const doc = new Y.Doc();
      Y.applyUpdate(doc, seed, REMOTE_ORIGIN);
      const origin = localOrigin(`u${i}`);
      const r: Replica = { doc, origin, undo: createPlanUndo(doc, origin), outbox: [] };
      doc.on('update', (u: Uint8Array, o: unknown) => {
        if (o !== REMOTE_ORIGIN) r.outbox.push(u);
      });
      return r;
    });
    const inFlight: Array<{ to: number; update: Uint8Array }> = [];
    let refused = 0;
    for (let step = 0; step < 300; step++) {
      const i = Math.floor(rand() * replicas.length);
      const { doc, origin, undo } = replicas[i];
      try {
        switch (pick(['value', 'tol', 'add', 'remove', 'ramp', 'threshold', 'undo'] as const)) {
          case 'value':
            setPartValue(
              doc,
              origin,
              pick(['R4', 'RL5', 'C3', 'RL33']),
              1 + Math.round(rand() * 1e5),
            );
            break;
          case 'tol':
            setTolerance(doc, origin, pick(['U1', 'U2']), pick(['softStart', 'vout']), {
              percent: Math.round(rand() * 30),
            });
            break;
          case 'add':
            addPart(doc, origin, {
              id: `X${step}`,
              kind: 'resistor',
              a: 'v33',
              b: '0',
              value: 1000,
            });
            break;
          case 'remove':
            removePart(doc, origin, pick(['RL33', `X${step - 1}`, `X${step - 2}`]));
            break;
          case 'ramp':
            moveRampPoint(doc, origin, 'v5', pick(['end', 'knee']), {
              t: 0.003 + rand() * 0.002,
              v: 4 + rand(),
            });
            break;
          case 'threshold':
            setThreshold(doc, origin, 'v33', 'in-regulation', 3 + rand() * 0.3);
            break;
          case 'undo':
            undo.undo();
            break;
        }
      } catch (err) {
        // Ops on entries this replica has not seen (or has removed) are refused by name.
        if (!(err instanceof PlanEditError)) throw err;
        refused++;
      }
      for (const r of replicas) {
        for (const update of r.outbox.splice(0)) {
          replicas.forEach((_, to) => {
            if (r !== replicas[to]) inFlight.push({ to, update });
          });
        }
      }
      // Deliver a random subset, in random order.
      for (let k = inFlight.length - 1; k >= 0; k--) {
        if (rand() < 0.3) {
          const [m] = inFlight.splice(k, 1);
          Y.applyUpdate(replicas[m.to].doc, m.update, REMOTE_ORIGIN);
        }
      }
    }
    for (const m of inFlight.splice(0)) Y.applyUpdate(replicas[m.to].doc, m.update, REMOTE_ORIGIN);
    const hashes = replicas.map((r) =>
      contentHash({ plan: docToPlan(r.doc), intents: readIntents(r.doc) }),
    );
    expect(new Set(hashes).size).toBe(1);
    expect(docToPlan(replicas[0].doc)).toEqual(docToPlan(replicas[5].doc));
    expect(refused).toBeLessThan(300);
    replicas.forEach((r) => r.undo.destroy());
  });
});
