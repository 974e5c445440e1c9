import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  OnInit,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTooltipModule } from '@angular/material/tooltip';

import { docToPlan } from '@rampart/collab/doc/doc-to-plan';
import { readIntents } from '@rampart/collab/doc/drawn-intent';
import type { EditRecord } from '@rampart/collab/doc/edit-record';
import { resolveSettings } from '@rampart/collab/engine/plan/plan-settings';

import { AuthSession } from '../../shared/auth/auth-session';
import type { PlanSession } from '../../shared/plan-session/plan-session';
import { PlanSessions } from '../../shared/plan-session/plan-sessions';
import { ConnectionChip } from './connection-chip';
import { applyPartEdit } from './part-edit';
import { partRows } from './part-rows';
import { PartsTable, type PartFieldEdit } from './parts-table';
import { PresenceAvatars } from './presence-avatars';
import { SignalsList } from './signals-list';
import { TimeAxisStrip } from './time-axis-strip';

const READ_ONLY_REASON: Record<string, string> = {
  viewer: 'You are a viewer on this plan: you follow every change live but cannot edit it.',
  reviewer:
    'You are a reviewer on this plan: you follow it live and review it; editing is for editors.',
};

/**
 * `/plans/:planId`: the live plan. Everyone with it open sees the same document, each other's
 * presence and cursor time; editors change part values and tolerances in place (named ops, so
 * undo reverts only their own edits); viewers and reviewers get a read-only page (and the server
 * drops their updates anyway).
 */
@Component({
  selector: 'rp-live-plan',
  imports: [
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTooltipModule,
    ConnectionChip,
    PartsTable,
    PresenceAvatars,
    SignalsList,
    TimeAxisStrip,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '(document:keydown)': 'onKey($event)' },
  templateUrl: './live-plan.html',
  styleUrl: './live-plan.scss',
})
export class LivePlan implements OnInit {
  /** From the route (`withComponentInputBinding`). */
  readonly planId = input.required<string>();

  private readonly _sessions = inject(PlanSessions);
  private readonly _auth = inject(AuthSession);
  private readonly _destroyRef = inject(DestroyRef);
  protected readonly session = signal<PlanSession | null>(null);
  protected readonly fieldErrors = signal<Record<string, string>>({});
  protected readonly lastEdit = signal<string>('');

  private readonly _plan = computed(() => {
    const s = this.session();
    if (!s) return null;
    s.revision();
    return { plan: docToPlan(s.doc), intents: readIntents(s.doc) };
  });
  protected readonly name = computed(() => this._plan()?.plan.name || 'Live plan');
  protected readonly rows = computed(() => partRows(this._plan()?.plan.parts ?? []));
  protected readonly signals = computed(() => this._plan()?.plan.signals ?? []);
  protected readonly intents = computed(() => this._plan()?.intents ?? {});
  protected readonly duration = computed(() => {
    const p = this._plan();
    return p ? resolveSettings(p.plan).duration : 0.02;
  });
  protected readonly readOnlyReason = computed(() => {
    const s = this.session();
    if (!s?.readOnly()) return '';
    return READ_ONLY_REASON[s.role() ?? ''] ?? 'Your access to this plan is read-only.';
  });

  ngOnInit(): void {
    const user = this._auth.user();
    if (!user) return;
    const session = this._sessions.open(this.planId(), { id: user.id, name: user.name });
    this.session.set(session);
    this._destroyRef.onDestroy(() => session.close());
  }

  protected onPartEdit(edit: PartFieldEdit): void {
    const s = this.session();
    if (!s) return;
    const key = `${edit.partId}:${edit.column}`;
    const result = applyPartEdit(s, edit);
    this.fieldErrors.update((errors) => {
      const next = { ...errors };
      if (result.ok) delete next[key];
      else next[key] = result.error;
      return next;
    });
  }

  protected undo(): void {
    this._announce(this.session()?.undo(), 'Undid');
  }

  protected redo(): void {
    this._announce(this.session()?.redo(), 'Redid');
  }

  protected onCursor(time: number | null): void {
    this.session()?.setCursorTime(time);
  }

  /** Ctrl-Z / Ctrl-Shift-Z (and Ctrl-Y); inside a text field the browser's own undo wins. */
  protected onKey(event: KeyboardEvent): void {
    if (!(event.ctrlKey || event.metaKey)) return;
    const target = event.target as HTMLElement | null;
    if (target && (target.tagName === 'INPUT' || target.tagName === 'TEXTAREA')) return;
    const key = event.key.toLowerCase();
    if (key === 'z' && !event.shiftKey) this.undo();
    else if ((key === 'z' && event.shiftKey) || key === 'y') this.redo();
    else return;
    event.preventDefault();
  }

  private _announce(record: EditRecord | undefined, verb: string): void {
    if (!record) return;
    this.lastEdit.set(
      `${verb}: ${record.target} ${record.targetId}${record.field ? ` ${record.field}` : ''}`,
    );
  }
}
