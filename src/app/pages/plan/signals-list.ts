import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { formatEngineering } from '@rampart/collab/doc/engineering-notation';
import type { IntentTable } from '@rampart/collab/doc/drawn-intent';
import type { SignalSpec } from '@rampart/collab/engine/plan/plan-schema';

const ICONS: Record<string, string> = {
  rail: 'bolt',
  enable: 'toggle_on',
  'power-good': 'verified',
  reset: 'restart_alt',
  reference: 'straighten',
  other: 'show_chart',
};

/** The plan's signals: kind, nominal level, named thresholds and the drawn ramp. */
@Component({
  selector: 'rp-signals-list',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2>Signals</h2>
    <ul data-testid="signals-list">
      @for (s of items(); track s.id) {
        <li [attr.data-signal]="s.id">
          <mat-icon aria-hidden="true">{{ s.icon }}</mat-icon>
          <div>
            <strong>{{ s.id }}</strong> <span class="kind">{{ s.kind }} · {{ s.nominal }}</span>
            @if (s.thresholds) {
              <span class="detail">{{ s.thresholds }}</span>
            }
            @if (s.intent) {
              <span class="detail">Drawn: {{ s.intent }}</span>
            }
          </div>
        </li>
      }
    </ul>
  `,
  styles: `
    h2 {
      font: var(--mat-sys-title-medium);
      margin: 0 0 8px;
    }
    ul {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    li {
      display: flex;
      gap: 8px;
      padding: 6px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    mat-icon {
      color: var(--mat-sys-primary);
    }
    .kind {
      margin-left: 6px;
    }
    .kind,
    .detail {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
    .detail {
      display: block;
    }
  `,
})
export class SignalsList {
  readonly signals = input.required<readonly SignalSpec[]>();
  readonly intents = input<IntentTable>({});

  protected readonly items = computed(() =>
    this.signals().map((s) => {
      const intent = this.intents()[s.id];
      const thresholds = Object.entries(s.thresholds ?? {})
        .map(([name, v]) => `${name} ${formatEngineering(v, 'V', 4)}`)
        .join(' · ');
      return {
        id: s.label ? `${s.id} (${s.label})` : s.id,
        kind: s.kind,
        icon: ICONS[s.kind] ?? 'show_chart',
        nominal: formatEngineering(s.nominal, 'V', 4),
        thresholds,
        intent: intent
          ? `${formatEngineering(intent.start, 's')} → ${formatEngineering(intent.end, 's')}, ` +
            `${formatEngineering(intent.level, 'V', 4)}`
          : '',
      };
    }),
  );
}
