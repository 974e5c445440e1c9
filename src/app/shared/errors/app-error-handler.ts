import { ErrorHandler, Injectable, inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';

/** Logs every uncaught error and tells the user once, with a way out (reload). */
@Injectable()
export class AppErrorHandler implements ErrorHandler {
  private readonly _snackBar = inject(MatSnackBar);

  handleError(error: unknown): void {
    console.error(error);
    const stale =
      error instanceof Error && /Failed to fetch dynamically imported module/.test(error.message);
    const message = stale
      ? 'A newer version of Rampart is available.'
      : 'Something went wrong. Your shared plan is safe on the server.';
    this._snackBar
      .open(message, 'Reload', { duration: 10_000 })
      .onAction()
      .subscribe(() => location.reload());
  }
}
