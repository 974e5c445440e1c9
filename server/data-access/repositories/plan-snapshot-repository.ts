import type { DataSource } from 'typeorm';

import { PlanSnapshotEntity } from '../entities/plan-snapshot.entity';

/** A snapshot as the rest of the server sees it (no entity leaves `data-access/`). */
export interface SnapshotRecord {
  id: string;
  planId: string;
  message: string;
  authorId: string | null;
  createdAt: Date;
  contentHash: string;
  atSeq: number;
}

export interface SnapshotWithState extends SnapshotRecord {
  state: Uint8Array;
}

function record(e: PlanSnapshotEntity): SnapshotRecord {
  return {
    id: e.id,
    planId: e.planId,
    message: e.message,
    authorId: e.authorId,
    createdAt: e.createdAt,
    contentHash: e.contentHash,
    atSeq: Number(e.atSeq),
  };
}

/** Named versions of plan documents. Rows are only ever added. */
export class PlanSnapshotRepository {
  constructor(private readonly dataSource: DataSource) {}

  private get repo() {
    return this.dataSource.getRepository(PlanSnapshotEntity);
  }

  async create(input: Omit<SnapshotWithState, 'id' | 'createdAt'>): Promise<SnapshotRecord> {
    const saved = await this.repo.save(
      this.repo.create({
        planId: input.planId,
        message: input.message,
        authorId: input.authorId,
        contentHash: input.contentHash,
        atSeq: String(input.atSeq),
        state: Buffer.from(input.state.buffer, input.state.byteOffset, input.state.byteLength),
      }),
    );
    return record(saved);
  }

  /** Newest first. */
  async list(planId: string): Promise<SnapshotRecord[]> {
    const rows = await this.repo.find({
      where: { planId },
      order: { createdAt: 'DESC' },
      // Without the state bytes: a list must not load every version's document.
      select: {
        id: true,
        planId: true,
        message: true,
        authorId: true,
        createdAt: true,
        contentHash: true,
        atSeq: true,
      },
    });
    return rows.map(record);
  }

  async get(planId: string, id: string): Promise<SnapshotWithState | null> {
    const row = await this.repo.findOneBy({ planId, id });
    if (!row) return null;
    return {
      ...record(row),
      state: new Uint8Array(row.state.buffer, row.state.byteOffset, row.state.byteLength),
    };
  }
}
