import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { ConnectionState } from '../../shared/plan-session/plan-session';

const VIEW: Record<ConnectionState, { icon: string; label: string; tone: string }> = {
  connecting: { icon: 'sync', label: 'Connecting…', tone: 'warn' },
  synced: { icon: 'cloud_done', label: 'Live', tone: 'ok' },
  offline: { icon: 'cloud_off', label: 'Offline, edits kept here', tone: 'bad' },
  'read-only': { icon: 'visibility', label: 'Live, read-only', tone: 'ok' },
};

/** Connection state and unsent edits, as icon + words (never colour alone). */
@Component({
  selector: 'rp-connection-chip',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <span class="chip" [class]="view().tone" role="status" data-testid="connection-state">
      <mat-icon aria-hidden="true">{{ view().icon }}</mat-icon>{{ view().label }}
    </span>
    @if (unsent()) {
      <span class="chip warn" role="status" data-testid="unsent-edits">
        <mat-icon aria-hidden="true">cloud_upload</mat-icon>Unsent edits
      </span>
    } @else if (state() !== 'read-only') {
      <span class="chip quiet" data-testid="all-saved">
        <mat-icon aria-hidden="true">check</mat-icon>All edits saved
      </span>
    }
  `,
  styles: `
    :host {
      display: inline-flex;
      gap: 8px;
      flex-wrap: wrap;
    }
    .chip {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      padding: 2px 10px 2px 6px;
      border-radius: 999px;
      border: 1px solid currentColor;
      font: var(--mat-sys-label-large);
    }
    .ok {
      color: var(--rp-ok);
    }
    .warn {
      color: var(--rp-warn);
    }
    .bad {
      color: var(--rp-bad);
    }
    .quiet {
      color: var(--mat-sys-on-surface-variant);
      border-color: var(--mat-sys-outline-variant);
    }
  `,
})
export class ConnectionChip {
  readonly state = input.required<ConnectionState>();
  /** Whether some local edit is not yet stored by the server. */
  readonly unsent = input(false);

  protected readonly view = computed(() => VIEW[this.state()]);
}
