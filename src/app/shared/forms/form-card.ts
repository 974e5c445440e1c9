import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';

/**
 * The frame of the small account forms (sign-in, register, passwords, invitations): an outlined
 * card with an icon, a heading and an optional line under it; the form goes inside.
 */
@Component({
  selector: 'rp-form-card',
  imports: [MatCardModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card appearance="outlined">
      <mat-card-header>
        <mat-icon mat-card-avatar aria-hidden="true">{{ icon() }}</mat-icon>
        <mat-card-title
          ><h1>{{ heading() }}</h1></mat-card-title
        >
        @if (subheading()) {
          <mat-card-subtitle>{{ subheading() }}</mat-card-subtitle>
        }
      </mat-card-header>
      <mat-card-content>
        <ng-content />
      </mat-card-content>
    </mat-card>
  `,
  styles: `
    :host {
      display: block;
      max-width: 460px;
      margin: 40px auto;
      padding: 0 16px;
    }
    h1 {
      font: inherit;
      margin: 0;
    }
    mat-icon[mat-card-avatar] {
      font-size: 32px;
      width: 40px;
      height: 40px;
      color: var(--mat-sys-primary);
    }
    mat-card-content {
      padding-top: 16px;
    }
  `,
})
export class FormCard {
  /** Material Symbols ligature shown beside the heading. */
  readonly icon = input.required<string>();
  readonly heading = input.required<string>();
  readonly subheading = input<string>('');
}
