import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';

import { HealthState } from './health-service';

/** A compact status chip: icon + words, never colour alone. */
@Component({
  selector: 'rp-health-badge',
  imports: [MatIconModule, MatTooltipModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <span
      class="badge"
      [class]="view().tone"
      role="status"
      aria-live="polite"
      [matTooltip]="view().detail"
      data-testid="health-badge"
    >
      <mat-icon aria-hidden="true">{{ view().icon }}</mat-icon>
      {{ view().label }}
    </span>
  `,
  styles: `
    .badge {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      padding: 2px 10px 2px 6px;
      border-radius: 999px;
      font: var(--mat-sys-label-large);
      border: 1px solid currentColor;
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
  `,
})
export class HealthBadge {
  /** Latest health state from `HealthService`. */
  readonly state = input.required<HealthState>();

  protected readonly view = computed(() => describe(this.state()));
}

function describe(state: HealthState): {
  icon: string;
  label: string;
  detail: string;
  tone: string;
} {
  switch (state.kind) {
    case 'checking':
      return {
        icon: 'hourglass_empty',
        label: 'Checking…',
        detail: 'Asking the server',
        tone: 'warn',
      };
    case 'unreachable':
      return { icon: 'cloud_off', label: state.message, detail: state.message, tone: 'bad' };
    case 'report': {
      const db = state.report.database;
      return db.status === 'up'
        ? {
            icon: 'check_circle',
            label: 'Database up',
            detail: `${db.version ?? ''} · ${db.latencyMs ?? '?'} ms`,
            tone: 'ok',
          }
        : {
            icon: 'error',
            label: 'Database down',
            detail: 'The server cannot reach PostgreSQL',
            tone: 'bad',
          };
    }
  }
}
