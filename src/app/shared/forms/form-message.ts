import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** Tone of a form-level message; always shown with an icon and words, never colour alone. */
export type FormMessageTone = 'error' | 'info' | 'success';

const ICONS: Record<FormMessageTone, string> = {
  error: 'error',
  info: 'info',
  success: 'check_circle',
};

/**
 * A message above or under a form: the server's refusal, or a confirmation. Errors are announced
 * at once (`role="alert"`), the others politely.
 */
@Component({
  selector: 'rp-form-message',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: {
    '[class]': 'tone()',
    '[attr.role]': "tone() === 'error' ? 'alert' : 'status'",
  },
  template: `
    <mat-icon aria-hidden="true">{{ icons[tone()] }}</mat-icon>
    <span><ng-content /></span>
  `,
  styles: `
    :host {
      display: flex;
      gap: 8px;
      align-items: flex-start;
      padding: 10px 12px;
      margin: 0 0 16px;
      border-radius: 8px;
      border: 1px solid currentColor;
      font: var(--mat-sys-body-medium);
    }
    :host(.error) {
      color: var(--rp-bad);
    }
    :host(.info) {
      color: var(--rp-ok);
    }
    :host(.success) {
      color: var(--rp-ok);
    }
    mat-icon {
      flex: none;
    }
    span {
      color: var(--mat-sys-on-surface);
    }
  `,
})
export class FormMessage {
  readonly tone = input<FormMessageTone>('error');
  protected readonly icons = ICONS;
}
