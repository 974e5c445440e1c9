/**
 * HTTP contract of plan snapshots (named versions). Routes are under `/api/plans/:planId`;
 * errors use the API's one shape; state-changing routes need the CSRF header.
 *
 * - `GET  /snapshots` → `SnapshotDto[]`, newest first (plan:read)
 * - `POST /snapshots` `CreateSnapshotRequest` → 201 `SnapshotDto` (plan:edit)
 * - `POST /snapshots/:snapshotId/restore` → 200 `RestoreResult` (plan:edit). The snapshot's
 *   content comes back as a new forward edit; history is never rewritten.
 * - `GET  /snapshots/compare?from=<id>&to=<id|current>[&margins=nominal]` →
 *   `SnapshotComparison` (plan:read). `margins=nominal` also runs a nominal analysis of both
 *   plans and lists requirement margins that changed (slower: about 0.2 s per plan).
 */
import type { PlanDiff } from '../doc/diff-plans';

export interface SnapshotDto {
  id: string;
  planId: string;
  message: string;
  authorId: string | null;
  createdAt: string;
  /** `sha256:<hex>` of the plan's canonical JSON. */
  contentHash: string;
  /** The plan's last stored update when the snapshot was taken. */
  atSeq: number;
}

export interface CreateSnapshotRequest {
  /** 1–500 characters. */
  message: string;
}

export interface RestoreResult {
  /** Seq of the forward update that restored the content; null when nothing differed. */
  seq: number | null;
}

export interface SnapshotComparison {
  from: string;
  to: string;
  diff: PlanDiff;
}
