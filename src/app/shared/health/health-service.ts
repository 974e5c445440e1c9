import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, of, startWith, switchMap, timer } from 'rxjs';

import { HealthReport, parseHealthReport } from '@rampart/collab/api/health';

/** What the shell shows about the back end: still asking, an answer, or why there is none. */
export type HealthState =
  | { kind: 'checking' }
  | { kind: 'report'; report: HealthReport }
  | { kind: 'unreachable'; message: string };

/** Polls `/api/health` so the shell can show whether the server and database are up. */
@Injectable({ providedIn: 'root' })
export class HealthService {
  private readonly _http = inject(HttpClient);

  /** One request; a 503 still carries a report (database down), anything else is unreachable. */
  check(): Observable<HealthState> {
    return this._http.get<unknown>('/api/health').pipe(
      map((body) => toState(body)),
      catchError((err: unknown) => {
        if (err instanceof HttpErrorResponse && err.status === 503) return of(toState(err.error));
        const status = err instanceof HttpErrorResponse ? err.status : 0;
        return of<HealthState>({
          kind: 'unreachable',
          message: status ? `Server answered ${status}` : 'Server unreachable',
        });
      }),
    );
  }

  /** Checks now and then every `periodMs`. */
  watch(periodMs = 30_000): Observable<HealthState> {
    return timer(0, periodMs).pipe(
      switchMap(() => this.check()),
      startWith<HealthState>({ kind: 'checking' }),
    );
  }
}

function toState(body: unknown): HealthState {
  const report = parseHealthReport(body);
  return report
    ? { kind: 'report', report }
    : { kind: 'unreachable', message: 'Unexpected answer from the server' };
}
