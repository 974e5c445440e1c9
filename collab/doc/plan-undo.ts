/**
 * Per-user undo and redo. Tracks only this session's local origin, so undo never reverts a
 * collaborator's edit or a load from storage; each named op is one undo step.
 */
import * as Y from 'yjs';

import { rootTypes } from './doc-layout';
import type { LocalOrigin } from './doc-origin';
import { editOf, type EditRecord } from './edit-record';

/** Undo/redo of one user's edits on one plan document. */
export interface PlanUndo {
  /** Reverts the latest own edit; returns what it reverted, or undefined when nothing to undo. */
  undo(): EditRecord | undefined;
  /** Re-applies the latest undone edit; returns it, or undefined when nothing to redo. */
  redo(): EditRecord | undefined;
  canUndo(): boolean;
  canRedo(): boolean;
  /** Called after every change of the stacks; returns an unsubscribe function. */
  onChange(listener: () => void): () => void;
  /** The underlying manager: its transactions are local edits too (send them to the relay). */
  readonly manager: Y.UndoManager;
  destroy(): void;
}

/** Options of `createPlanUndo`. */
export interface PlanUndoOptions {
  /**
   * Edits closer together than this merge into one undo step. 0 keeps every named op separate.
   * @default 0
   */
  captureTimeout?: number;
}

const RECORD_KEY = 'record';

/** Undo/redo for edits made with `origin` (keep that object for the whole session). */
export function createPlanUndo(
  doc: Y.Doc,
  origin: LocalOrigin,
  options: PlanUndoOptions = {},
): PlanUndo {
  const manager = new Y.UndoManager(rootTypes(doc), {
    trackedOrigins: new Set([origin]),
    captureTimeout: options.captureTimeout ?? 0,
  });
  const listeners = new Set<() => void>();
  const notify = () => listeners.forEach((l) => l());
  // Keep the edit record on each stack item so undo can say what it reverted. Stack events do
  // not carry the transaction, so a fresh edit's record is caught just before; when an item
  // moves between the undo and redo stacks Yjs makes a new item with empty meta, so the record
  // is copied from the item being popped (`currStackItem`).
  let pending: EditRecord | undefined;
  const catchRecord = (tr: Y.Transaction) => {
    if (tr.origin === origin) pending = editOf(tr);
  };
  doc.on('beforeObserverCalls', catchRecord);
  manager.on('stack-item-added', (event) => {
    const record =
      event.origin === manager
        ? (manager.currStackItem?.meta.get(RECORD_KEY) as EditRecord | undefined)
        : pending;
    if (record) event.stackItem.meta.set(RECORD_KEY, record);
    pending = undefined;
    notify();
  });
  manager.on('stack-item-popped', notify);
  manager.on('stack-cleared', notify);
  const recordOf = (item: { meta: Map<unknown, unknown> } | null): EditRecord | undefined =>
    item ? (item.meta.get(RECORD_KEY) as EditRecord | undefined) : undefined;
  return {
    manager,
    undo: () => recordOf(manager.undo()),
    redo: () => recordOf(manager.redo()),
    canUndo: () => manager.canUndo(),
    canRedo: () => manager.canRedo(),
    onChange(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    destroy() {
      listeners.clear();
      doc.off('beforeObserverCalls', catchRecord);
      manager.destroy();
    },
  };
}
