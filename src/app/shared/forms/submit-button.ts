import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';

/**
 * The primary submit button of a form: disabled while the request is pending, with a spinner
 * named for what is happening (`busyLabel`, read by screen readers). Content is the button text.
 */
@Component({
  selector: 'rp-submit-button',
  imports: [MatButtonModule, MatProgressSpinnerModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <button matButton="filled" type="submit" [disabled]="pending()">
      @if (pending()) {
        <mat-spinner diameter="18" [attr.aria-label]="busyLabel()" />
      }
      <ng-content />
    </button>
  `,
  styles: `
    :host {
      display: contents;
    }
    mat-spinner {
      display: inline-block;
      margin-right: 6px;
      vertical-align: middle;
    }
  `,
})
export class SubmitButton {
  /** The request is in flight: the button is disabled and shows the spinner. */
  readonly pending = input(false);
  /** What the spinner announces, e.g. "Saving". */
  readonly busyLabel = input.required<string>();
}
