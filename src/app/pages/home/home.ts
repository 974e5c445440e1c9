import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { AuthSession } from '../../shared/auth/auth-session';

/** Landing page: what Rampart does and where to start. */
@Component({
  selector: 'rp-home',
  imports: [MatCardModule, MatButtonModule, MatIconModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="hero">
      <h1>Power sequencing, planned together</h1>
      <p>
        Draw the intended timing of every rail, enable, power-good, reset and reference; describe
        the circuit that produces it; state the requirements. Rampart computes the real curves with
        worst-case corners and Monte Carlo spread, and reports every margin.
      </p>
      @if (session.isSignedIn()) {
        <a matButton="filled" routerLink="/teams"><mat-icon>groups</mat-icon> Open your teams</a>
      } @else {
        <a matButton="filled" routerLink="/sign-in"
          ><mat-icon>login</mat-icon> Sign in to your team</a
        >
      }
    </section>
    <section class="cards" aria-label="How a plan comes together">
      @for (step of steps; track step.title) {
        <mat-card appearance="outlined">
          <mat-card-header>
            <mat-icon mat-card-avatar aria-hidden="true">{{ step.icon }}</mat-icon>
            <mat-card-title>{{ step.title }}</mat-card-title>
          </mat-card-header>
          <mat-card-content>{{ step.text }}</mat-card-content>
        </mat-card>
      }
    </section>
  `,
  styles: `
    :host {
      display: block;
      padding: 24px;
      max-width: 1100px;
      margin: 0 auto;
    }
    .hero h1 {
      font: var(--mat-sys-display-small);
      margin: 8px 0 12px;
    }
    .hero p {
      font: var(--mat-sys-body-large);
      max-width: 70ch;
    }
    .cards {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(240px, 1fr));
      gap: 16px;
      margin-top: 24px;
    }
    mat-icon[mat-card-avatar] {
      font-size: 32px;
      width: 40px;
      height: 40px;
      color: var(--mat-sys-primary);
    }
  `,
})
export class Home {
  protected readonly session = inject(AuthSession);
  protected readonly steps = [
    {
      icon: 'timeline',
      title: 'Intent',
      text: 'Each signal gets a drawn ramp: when it should start, how fast, to what level.',
    },
    {
      icon: 'memory',
      title: 'Circuit',
      text: 'Parts with tolerances, dielectric classes and temperature ranges produce the real curves.',
    },
    {
      icon: 'rule',
      title: 'Requirements',
      text: 'Order, delays, levels and no back-drive, each with a target margin.',
    },
    {
      icon: 'verified',
      title: 'Review',
      text: 'Reviewers comment on a moment in time and sign off a snapshot; trainees follow read-only.',
    },
  ];
}
