import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';

/** Sign-in page. Accounts arrive with the accounts work; until then this says so plainly. */
@Component({
  selector: 'rp-sign-in',
  imports: [MatCardModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card appearance="outlined">
      <mat-card-header>
        <mat-icon mat-card-avatar aria-hidden="true">lock</mat-icon>
        <mat-card-title>Sign in</mat-card-title>
        <mat-card-subtitle>Team accounts are not enabled on this server yet.</mat-card-subtitle>
      </mat-card-header>
    </mat-card>
  `,
  styles: `
    :host {
      display: block;
      max-width: 440px;
      margin: 48px auto;
      padding: 0 16px;
    }
  `,
})
export class SignIn {}
