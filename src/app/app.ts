import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink, RouterOutlet } from '@angular/router';

import { HealthBadge } from './shared/health/health-badge';
import { HealthService, HealthState } from './shared/health/health-service';
import { SafetyNote } from './shared/safety-note';
import { ThemeSwitch } from './shared/theme-switch';

/** The shell: toolbar, routed page, safety caution. */
@Component({
  selector: 'rp-root',
  imports: [
    RouterOutlet,
    RouterLink,
    MatToolbarModule,
    MatButtonModule,
    MatIconModule,
    MatTooltipModule,
    HealthBadge,
    SafetyNote,
    ThemeSwitch,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './app.html',
  styleUrl: './app.scss',
})
export class App {
  protected readonly health = toSignal(inject(HealthService).watch(), {
    initialValue: { kind: 'checking' } as HealthState,
  });
}
