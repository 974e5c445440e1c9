import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink, RouterOutlet } from '@angular/router';

import { AuthSession } from './shared/auth/auth-session';
import { UserMenu } from './shared/auth/user-menu';
import { HealthBadge } from './shared/health/health-badge';
import { HealthService, HealthState } from './shared/health/health-service';
import { SafetyNote } from './shared/safety-note';
import { TeamSwitcher } from './shared/teams/team-switcher';
import { ThemeSwitch } from './shared/theme-switch';

/** The shell: toolbar (who is signed in, team switcher, health), routed page, safety caution. */
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
    TeamSwitcher,
    UserMenu,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <a class="skip-link" href="#main">Skip to content</a>
    <mat-toolbar class="toolbar">
      <a class="brand" routerLink="/" aria-label="Rampart home">
        <img src="favicon.svg" alt="" width="28" height="28" />
        <span>Rampart</span>
      </a>
      <span class="spacer"></span>
      @if (session.isSignedIn()) {
        <rp-team-switcher />
      }
      <rp-health-badge [state]="health()" />
      <rp-theme-switch />
      @switch (session.status()) {
        @case ('signed-in') {
          <rp-user-menu />
        }
        @case ('signed-out') {
          <a matButton="tonal" routerLink="/sign-in">
            <mat-icon>login</mat-icon>
            Sign in
          </a>
        }
      }
    </mat-toolbar>
    <main id="main" class="content" tabindex="-1">
      <router-outlet />
    </main>
    <rp-safety-note />
  `,
  styleUrl: './app.scss',
})
export class App {
  protected readonly health = toSignal(inject(HealthService).watch(), {
    initialValue: { kind: 'checking' } as HealthState,
  });
  protected readonly session = inject(AuthSession);

  constructor() {
    // Ask who is signed in once at start, so the toolbar shows the user on every page. A failure
    // (server down) leaves the status unknown; the health badge already says why.
    this.session.ensureLoaded().subscribe({ error: () => undefined });
  }
}
