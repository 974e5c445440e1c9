import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { Observable, map } from 'rxjs';

/** What the confirmation asks. */
export interface ConfirmRequest {
  title: string;
  message: string;
  /** Words on the confirming button, e.g. "Remove". */
  confirm: string;
}

/** A yes/no question before something that cannot be undone from this screen. */
@Component({
  selector: 'rp-confirm-dialog',
  imports: [MatDialogModule, MatButtonModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content>{{ data.message }}</mat-dialog-content>
    <mat-dialog-actions align="end">
      <button matButton type="button" [mat-dialog-close]="false">Cancel</button>
      <button matButton="filled" type="button" [mat-dialog-close]="true">
        {{ data.confirm }}
      </button>
    </mat-dialog-actions>
  `,
})
export class ConfirmDialog {
  protected readonly data = inject<ConfirmRequest>(MAT_DIALOG_DATA);
}

/** Opens the dialog; emits true only when the user confirmed. */
export function askToConfirm(dialog: MatDialog, request: ConfirmRequest): Observable<boolean> {
  return dialog
    .open<ConfirmDialog, ConfirmRequest, boolean>(ConfirmDialog, {
      data: request,
      width: '420px',
      autoFocus: 'first-tabbable',
      restoreFocus: true,
    })
    .afterClosed()
    .pipe(map((answer) => answer === true));
}
