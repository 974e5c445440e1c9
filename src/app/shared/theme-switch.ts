import { ChangeDetectionStrategy, Component, computed, effect, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';

type ThemeChoice = 'system' | 'light' | 'dark';
const ORDER: readonly ThemeChoice[] = ['system', 'light', 'dark'];
const STORAGE_KEY = 'rampart.theme';

/** Cycles system → light → dark; remembered in local storage when it is available. */
@Component({
  selector: 'rp-theme-switch',
  imports: [MatButtonModule, MatIconModule, MatTooltipModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <button
      matIconButton
      type="button"
      (click)="next()"
      [matTooltip]="label()"
      [attr.aria-label]="label()"
    >
      <mat-icon>{{ icon() }}</mat-icon>
    </button>
  `,
})
export class ThemeSwitch {
  private readonly _choice = signal<ThemeChoice>(readStoredChoice());

  protected readonly icon = computed(
    () => ({ system: 'brightness_auto', light: 'light_mode', dark: 'dark_mode' })[this._choice()],
  );
  protected readonly label = computed(() => `Theme: ${this._choice()} (change)`);

  constructor() {
    effect(() => {
      const choice = this._choice();
      const root = document.documentElement;
      if (choice === 'system') root.removeAttribute('data-theme');
      else root.setAttribute('data-theme', choice);
      storeChoice(choice);
    });
  }

  protected next(): void {
    this._choice.update((c) => ORDER[(ORDER.indexOf(c) + 1) % ORDER.length]);
  }
}

function readStoredChoice(): ThemeChoice {
  // Storage can throw (privacy modes); the theme is a nicety, so fall back to the system's.
  try {
    const v = localStorage.getItem(STORAGE_KEY);
    return v === 'light' || v === 'dark' ? v : 'system';
  } catch {
    return 'system';
  }
}

function storeChoice(choice: ThemeChoice): void {
  try {
    localStorage.setItem(STORAGE_KEY, choice);
  } catch {
    // Not stored: the choice still applies for this visit.
  }
}
