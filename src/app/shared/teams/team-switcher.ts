import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectChange, MatSelectModule } from '@angular/material/select';
import { NavigationEnd, Router } from '@angular/router';
import { filter, map } from 'rxjs';

import { AuthSession } from '../auth/auth-session';

/**
 * Team switcher in the toolbar, shown when the user belongs to more than one team. It shows the
 * team of the current `/teams/:id` page and navigates to the one picked.
 */
@Component({
  selector: 'rp-team-switcher',
  imports: [MatFormFieldModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (teams().length > 1) {
      <mat-form-field appearance="outline" subscriptSizing="dynamic" class="switcher">
        <mat-select
          [value]="currentTeamId()"
          placeholder="Switch team"
          aria-label="Switch team"
          data-testid="team-switcher"
          (selectionChange)="open($event)"
        >
          @for (t of teams(); track t.teamId) {
            <mat-option [value]="t.teamId">{{ t.teamName }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
    }
  `,
  styles: `
    .switcher {
      width: 220px;
      --mat-form-field-container-height: 40px;
      --mat-form-field-container-vertical-padding: 8px;
    }
  `,
})
export class TeamSwitcher {
  private readonly _session = inject(AuthSession);
  private readonly _router = inject(Router);
  private readonly _url = toSignal(
    this._router.events.pipe(
      filter((e): e is NavigationEnd => e instanceof NavigationEnd),
      map((e) => e.urlAfterRedirects),
    ),
    { initialValue: this._router.url },
  );

  protected readonly teams = computed(() =>
    [...this._session.memberships()].sort((a, b) => a.teamName.localeCompare(b.teamName)),
  );
  /** The team of the page on screen, or null outside team pages. */
  protected readonly currentTeamId = computed(() => teamIdFromUrl(this._url()));

  protected open(change: MatSelectChange<string>): void {
    void this._router.navigate(['/teams', change.value]);
  }
}

/** `/teams/<id>…` → `<id>`; anything else → null. */
export function teamIdFromUrl(url: string): string | null {
  const match = /^\/teams\/([^/?#]+)/.exec(url);
  return match ? decodeURIComponent(match[1]) : null;
}
