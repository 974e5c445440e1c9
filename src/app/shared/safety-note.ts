import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The caution every screen and report carries. */
@Component({
  selector: 'rp-safety-note',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-icon aria-hidden="true">warning</mat-icon>
    <p>
      Results are engineering estimates. Verify them against datasheet limits and measurements, and
      follow local codes and licensed, qualified practice for safety-critical designs.
    </p>
  `,
  styles: `
    :host {
      display: flex;
      gap: 8px;
      align-items: center;
      padding: 8px 16px;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      border-top: 1px solid var(--mat-sys-outline-variant);
    }
    p {
      margin: 0;
    }
  `,
})
export class SafetyNote {}
