import { computed, signal, type Signal } from '@angular/core';
import { Awareness } from 'y-protocols/awareness';
import * as Y from 'yjs';

import type { Role } from '@rampart/collab/api/accounts';
import { REMOTE_ORIGIN, localOrigin, type LocalOrigin } from '@rampart/collab/doc/doc-origin';
import type { EditRecord } from '@rampart/collab/doc/edit-record';
import { createPlanUndo, type PlanUndo } from '@rampart/collab/doc/plan-undo';
import type { SyncError } from '@rampart/collab/sync/errors';
import { AWARENESS_PER_SECOND } from '@rampart/collab/sync/limits';
import type { Presence } from '@rampart/collab/sync/presence';

import type { OfflineCopy } from './offline-copy';
import { PlanSyncLink } from './plan-sync-link';
import type { PlanClientSocket } from './plan-socket';
import { initials, inkOn, presenceColour } from './presence-colour';

/** What the connection chip shows. */
export type ConnectionState = 'connecting' | 'synced' | 'offline' | 'read-only';

/** One person with the plan open (from awareness). */
export interface PresencePeer {
  clientId: number;
  userId: string;
  name: string;
  initials: string;
  colour: string;
  /** Text colour on `colour` (black or white, whichever contrasts more). */
  ink: string;
  /** Time under their cursor on the shared time axis, seconds. */
  cursorTime: number | null;
  isSelf: boolean;
}

/** Who is editing, for presence and the audit trail. */
export interface SessionUser {
  id: string;
  name: string;
}

/** Presence broadcasts per second, at most (the relay's limit is the same). */
const PRESENCE_PER_SECOND = AWARENESS_PER_SECOND;

/** A change of the optional presence fields; null removes the field. */
type PresencePatch = {
  [K in 'cursorTime' | 'selection' | 'viewport']?: Presence[K] | null;
};

/**
 * One open live plan: the doc, the connection state, presence, unsent edits, undo/redo and the
 * latest error, as signals. Made by `PlanSessions.open`; call `close()` when the page goes.
 */
export class PlanSession {
  /** The shared plan document. Read it with the `collab/doc` accessors. */
  readonly doc = new Y.Doc();
  readonly awareness = new Awareness(this.doc);
  /** The origin of this session's edits (undo tracks exactly these). */
  readonly origin: LocalOrigin;
  readonly undoManager: PlanUndo;

  private readonly _state = signal<ConnectionState>('connecting');
  private readonly _loaded = signal(false);
  private readonly _role = signal<Role | null>(null);
  private readonly _readOnly = signal(false);
  private readonly _unsent = signal(false);
  private readonly _unsentEdits = signal(0);
  private readonly _error = signal<SyncError | null>(null);
  private readonly _presence = signal<readonly PresencePeer[]>([]);
  private readonly _revision = signal(0);
  private readonly _undoState = signal({ canUndo: false, canRedo: false });
  private readonly _link: PlanSyncLink;
  private _presenceTimer: ReturnType<typeof setTimeout> | undefined;
  private _pendingPresence: PresencePatch = {};
  private _lastPresenceAt = 0;
  private _closed = false;
  private readonly _offline: OfflineCopy | null;

  /** `connecting` | `synced` | `offline` | `read-only`. */
  readonly state: Signal<ConnectionState> = this._state.asReadonly();
  /**
   * Whether the doc holds the plan, from the relay or from this browser's offline copy (a reload
   * while offline shows the copy); false: show a loading state.
   */
  readonly loaded: Signal<boolean> = this._loaded.asReadonly();
  readonly role: Signal<Role | null> = this._role.asReadonly();
  /** True for viewers and reviewers: the UI must not offer edits. */
  readonly readOnly: Signal<boolean> = this._readOnly.asReadonly();
  /** Some local change has not been acknowledged as stored by the server yet. */
  readonly hasUnsentEdits: Signal<boolean> = this._unsent.asReadonly();
  /**
   * How many edits made in this browser the server has not acknowledged yet (kept with the
   * offline copy, so a reload restores it); 0 once everything is stored.
   */
  readonly unsentEdits: Signal<number> = this._unsentEdits.asReadonly();
  /** The latest error to show (update denied, access revoked…); null when none. */
  readonly error: Signal<SyncError | null> = this._error.asReadonly();
  /** Everyone with the plan open, this tab first. */
  readonly presence: Signal<readonly PresencePeer[]> = this._presence.asReadonly();
  /** Bumps on every doc change: `computed(() => (session.revision(), readParts(session.doc)))`. */
  readonly revision: Signal<number> = this._revision.asReadonly();
  readonly canUndo = computed(() => this._undoState().canUndo);
  readonly canRedo = computed(() => this._undoState().canRedo);

  constructor(
    readonly planId: string,
    readonly user: SessionUser,
    socket: PlanClientSocket,
    attachOffline: (doc: Y.Doc) => OfflineCopy | null,
  ) {
    this._offline = attachOffline(this.doc);
    this.origin = localOrigin(user.id, user.name);
    this.undoManager = createPlanUndo(this.doc, this.origin);
    this.undoManager.onChange(() =>
      this._undoState.set({
        canUndo: this.undoManager.canUndo(),
        canRedo: this.undoManager.canRedo(),
      }),
    );
    this.doc.on('update', () => this._revision.update((r) => r + 1));
    this.awareness.on('change', () => this._refreshPresence());
    const me: Presence = {
      user: { id: user.id, name: user.name || user.id, colour: presenceColour(user.id) },
    };
    this.awareness.setLocalState(me);
    this._refreshPresence();
    this._link = new PlanSyncLink(socket, planId, this.doc, this.awareness, {
      connecting: () => this._state.set('connecting'),
      joined: (r) => {
        this._role.set(r.role);
        this._readOnly.set(r.readOnly);
        this._error.set(null);
      },
      loaded: () => {
        this._loaded.set(true);
        this._state.set(this._readOnly() ? 'read-only' : 'synced');
      },
      offline: () => this._state.set('offline'),
      unsent: (v) => {
        this._unsent.set(v);
        if (!v) this._countUnsent(0);
      },
      error: (e) => this._error.set(e),
      accessChanged: (role, readOnly) => {
        this._role.set(role);
        this._readOnly.set(readOnly);
        if (role === null) {
          this._state.set('offline');
          this._error.set({ code: 'forbidden', message: 'Your access to this plan was removed.' });
        } else if (this._loaded()) this._state.set(readOnly ? 'read-only' : 'synced');
      },
    });
  }

  /** Starts syncing once the offline copy (if any) has been merged into the doc. */
  async start(): Promise<void> {
    const stored = await this._offline?.loaded;
    if (this._closed) return;
    if (stored?.hasPlan) this._loaded.set(true);
    if (stored && stored.unsentEdits > 0) {
      this._unsentEdits.set(stored.unsentEdits);
      this._unsent.set(true);
    }
    // Registered before the link's own listener, so an ack that arrives within the same update
    // (it can, from an in-memory relay) resets a count that already includes the edit.
    this.doc.on('update', (_update: Uint8Array, origin: unknown) => {
      if (origin !== REMOTE_ORIGIN) this._countUnsent(this._unsentEdits() + 1);
    });
    this._link.start();
  }

  /**
   * Runs a named op (`setPartValue`, `moveRampPoint`…) as this user. Refused with an error
   * signal, returning null, when the session is read-only; op errors (`PlanEditError`) propagate.
   */
  edit(op: (doc: Y.Doc, origin: LocalOrigin) => EditRecord): EditRecord | null {
    if (this._readOnly()) {
      this._error.set({ code: 'read_only', message: 'Your role on this plan is read-only.' });
      return null;
    }
    return op(this.doc, this.origin);
  }

  /** Reverts this user's latest edit (never a collaborator's). */
  undo(): EditRecord | undefined {
    return this._readOnly() ? undefined : this.undoManager.undo();
  }

  redo(): EditRecord | undefined {
    return this._readOnly() ? undefined : this.undoManager.redo();
  }

  /** Publishes the time under this user's cursor (null: off the axis), at most 10 times a second. */
  setCursorTime(time: number | null): void {
    this._publish({ cursorTime: time });
  }

  /** Publishes what this user has selected (shown to others as highlights). */
  setSelection(selection: Presence['selection'] | null): void {
    this._publish({ selection: selection ?? null });
  }

  /** Publishes the visible time window, seconds. */
  setViewport(viewport: Presence['viewport'] | null): void {
    this._publish({ viewport: viewport ?? null });
  }

  /** Dismisses the current error. */
  clearError(): void {
    this._error.set(null);
  }

  /** Leaves the plan and releases the socket, awareness, undo and offline copy. */
  close(): void {
    if (this._closed) return;
    this._closed = true;
    clearTimeout(this._presenceTimer);
    this._link.destroy();
    this.undoManager.destroy();
    this._offline?.destroy();
    // Destroying the doc also destroys its awareness (and the awareness interval timer).
    this.doc.destroy();
  }

  private _countUnsent(count: number): void {
    if (count === this._unsentEdits()) return;
    this._unsentEdits.set(count);
    this._offline?.setUnsentEdits(count);
  }

  /** Merges a presence change and sends it, throttled: presence can cost more than edits. */
  private _publish(patch: PresencePatch): void {
    this._pendingPresence = { ...this._pendingPresence, ...patch };
    const wait = this._lastPresenceAt + 1000 / PRESENCE_PER_SECOND - Date.now();
    if (wait <= 0) this._flushPresence();
    else if (this._presenceTimer === undefined) {
      this._presenceTimer = setTimeout(() => this._flushPresence(), wait);
    }
  }

  private _flushPresence(): void {
    this._presenceTimer = undefined;
    const patch = this._pendingPresence;
    this._pendingPresence = {};
    const state = this.awareness.getLocalState() as Presence | null;
    if (this._closed || !state || Object.keys(patch).length === 0) return;
    this._lastPresenceAt = Date.now();
    const next: Record<string, unknown> = { ...state };
    for (const [key, value] of Object.entries(patch)) {
      // null clears a field: the relay accepts only known fields with valid values.
      if (value === null) delete next[key];
      else next[key] = value;
    }
    this.awareness.setLocalState(next as unknown as Presence);
  }

  private _refreshPresence(): void {
    const peers: PresencePeer[] = [];
    for (const [clientId, raw] of this.awareness.getStates()) {
      const state = raw as Partial<Presence>;
      if (!state.user) continue;
      peers.push({
        clientId,
        userId: state.user.id,
        name: state.user.name,
        initials: initials(state.user.name),
        colour: state.user.colour,
        ink: inkOn(state.user.colour),
        cursorTime: typeof state.cursorTime === 'number' ? state.cursorTime : null,
        isSelf: clientId === this.doc.clientID,
      });
    }
    peers.sort((a, b) => Number(b.isSelf) - Number(a.isSelf) || a.name.localeCompare(b.name));
    this._presence.set(peers);
  }
}
