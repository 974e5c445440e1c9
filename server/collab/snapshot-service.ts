import * as Y from 'yjs';

import { contentHash } from '@rampart/collab/doc/content-hash';
import { ROOT } from '@rampart/collab/doc/doc-layout';
import { docToPlan } from '@rampart/collab/doc/doc-to-plan';
import { diffPlans, type MarginTable, type PlanDiff } from '@rampart/collab/doc/diff-plans';
import { analyzePlan } from '@rampart/collab/engine/analysis/analyze-plan';
import type { Plan } from '@rampart/collab/engine/plan/plan-schema';
import { parsePlan } from '@rampart/collab/engine/plan/validate-plan';
import { simulate } from '@rampart/collab/engine/sim/simulate';

import type { PlanDocumentRepository } from '../data-access/repositories/plan-document-repository';
import type {
  PlanSnapshotRepository,
  SnapshotRecord,
} from '../data-access/repositories/plan-snapshot-repository';
import { AppError } from '../errors/app-error';
import { reconcileMap } from './reconcile-doc';
import type { RoomRegistry } from './room-registry';

/**
 * Named versions of a plan: take one from the current document, list them, compare two, and
 * restore one as a new forward update (the log keeps everything that happened before).
 */
export class SnapshotService {
  constructor(
    private readonly documents: PlanDocumentRepository,
    private readonly snapshots: PlanSnapshotRepository,
    private readonly registry: RoomRegistry,
  ) {}

  list(planId: string): Promise<SnapshotRecord[]> {
    return this.snapshots.list(planId);
  }

  async create(planId: string, authorId: string, message: string): Promise<SnapshotRecord> {
    const { doc, lastSeq } = await this.currentDoc(planId);
    try {
      return await this.snapshots.create({
        planId,
        authorId,
        message,
        state: Y.encodeStateAsUpdate(doc),
        contentHash: hashDoc(doc),
        atSeq: lastSeq,
      });
    } finally {
      doc.destroy();
    }
  }

  /**
   * Compares snapshot `fromId` with snapshot `toId`, or with the current plan (`'current'`).
   * With `margins`, both plans get a nominal analysis (about 0.2 s each for the demo plan, on
   * this process's event loop, hence opt-in) and changed requirement margins are listed.
   */
  async compare(planId: string, fromId: string, toId: string, margins = false): Promise<PlanDiff> {
    const from = await this.snapshotDoc(planId, fromId);
    const to =
      toId === 'current'
        ? (await this.currentDoc(planId)).doc
        : await this.snapshotDoc(planId, toId);
    try {
      const before = readPlan(from, fromId);
      const after = readPlan(to, toId);
      if (!margins) return diffPlans(before, after);
      return diffPlans(before, after, {
        marginsBefore: nominalMargins(before),
        marginsAfter: nominalMargins(after),
      });
    } finally {
      from.destroy();
      to.destroy();
    }
  }

  /** Writes the snapshot's content over the current plan as one new, stored update. */
  async restore(planId: string, snapshotId: string, authorId: string): Promise<number | null> {
    const source = await this.snapshotDoc(planId, snapshotId);
    const { doc: work } = await this.currentDoc(planId);
    const updates: Uint8Array[] = [];
    work.on('update', (u: Uint8Array) => updates.push(u));
    try {
      Y.transact(work, () => {
        for (const name of Object.values(ROOT))
          reconcileMap(work.getMap(name), source.getMap(name));
      });
      if (updates.length === 0) return null;
      const forward = Y.mergeUpdates(updates);
      const room = this.registry.get(planId);
      // Through the open room, so connected clients receive it like any edit.
      if (room) return await this.registry.store(room, forward, authorId);
      const [seq] = await this.documents.append(planId, [{ update: forward, authorId }]);
      this.registry.announceStored(planId, forward, seq!);
      return seq!;
    } finally {
      source.destroy();
      work.destroy();
    }
  }

  /** A private copy of the plan's current document (the open room's, else the stored one). */
  private async currentDoc(planId: string): Promise<{ doc: Y.Doc; lastSeq: number }> {
    const doc = new Y.Doc();
    const room = this.registry.get(planId);
    if (room) {
      Y.applyUpdate(doc, Y.encodeStateAsUpdate(room.doc));
      return { doc, lastSeq: room.contiguousSeq };
    }
    const stored = await this.documents.load(planId);
    Y.applyUpdate(doc, stored.state);
    for (const u of stored.updates) Y.applyUpdate(doc, u.update);
    return { doc, lastSeq: stored.lastSeq };
  }

  private async snapshotDoc(planId: string, snapshotId: string): Promise<Y.Doc> {
    const snapshot = await this.snapshots.get(planId, snapshotId);
    if (!snapshot) throw new AppError('not_found', 'No such snapshot');
    const doc = new Y.Doc();
    Y.applyUpdate(doc, snapshot.state);
    return doc;
  }
}

function readPlan(doc: Y.Doc, which: string): Plan {
  try {
    return docToPlan(doc);
  } catch (err) {
    throw new AppError(
      'unprocessable',
      `Snapshot ${which} does not hold a readable plan`,
      undefined,
      {
        cause: err,
      },
    );
  }
}

/**
 * Each requirement's smallest nominal margin over the plan's cases (null when never measured);
 * empty when the plan cannot be analysed (an incomplete plan still compares by content).
 */
function nominalMargins(plan: Plan): MarginTable {
  try {
    const result = analyzePlan(parsePlan(plan), { simulate });
    const table: Record<string, number | null> = {};
    for (const c of result.cases) {
      for (const r of c.requirements) {
        const prev = table[r.requirementId];
        if (r.margin === null) table[r.requirementId] = prev ?? null;
        else table[r.requirementId] = prev == null ? r.margin : Math.min(prev, r.margin);
      }
    }
    return table;
  } catch {
    return {};
  }
}

/** The doc's content hash: of its plan when readable, else of its raw shared maps. */
function hashDoc(doc: Y.Doc): string {
  try {
    return contentHash(docToPlan(doc));
  } catch {
    const raw: Record<string, unknown> = {};
    for (const name of Object.values(ROOT)) raw[name] = doc.getMap(name).toJSON();
    return contentHash(raw);
  }
}
