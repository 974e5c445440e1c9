import { HttpErrorResponse } from '@angular/common/http';

import type { ApiErrorBody } from '@rampart/collab/api/accounts';

/** What a form needs from a failed request: one sentence, and per-field messages if any. */
export interface ApiProblem {
  /** HTTP status (0 when the server could not be reached). */
  status: number;
  /** The API's machine-readable code, or a local one (`network`, `unexpected`). */
  code: string;
  /** A sentence safe to show to the user. */
  message: string;
  /** Field path → message, from the API's `fields`. */
  fields: Record<string, string>;
}

/**
 * Turns anything a request can fail with into an `ApiProblem`. The server's own message is kept
 * because it is written for people; a body of another shape gets a generic sentence, never raw
 * text from a proxy or a stack.
 */
export function toApiProblem(err: unknown): ApiProblem {
  if (!(err instanceof HttpErrorResponse)) {
    return { status: 0, code: 'unexpected', message: 'Something went wrong.', fields: {} };
  }
  if (err.status === 0) {
    return {
      status: 0,
      code: 'network',
      message: 'The server cannot be reached. Check your connection and try again.',
      fields: {},
    };
  }
  const body = parseErrorBody(err.error);
  if (!body) {
    return {
      status: err.status,
      code: 'unexpected',
      message: fallbackMessage(err.status),
      fields: {},
    };
  }
  const fields: Record<string, string> = {};
  for (const f of body.error.fields ?? []) {
    // The first message per field is the one to show; later ones usually repeat it.
    if (!(f.path in fields)) fields[f.path] = f.message;
  }
  return { status: err.status, code: body.error.code, message: body.error.message, fields };
}

/** The API's error body, or null when `value` has another shape. */
export function parseErrorBody(value: unknown): ApiErrorBody | null {
  if (typeof value !== 'object' || value === null) return null;
  const error = (value as { error?: unknown }).error;
  if (typeof error !== 'object' || error === null) return null;
  const { code, message, fields } = error as Record<string, unknown>;
  if (typeof code !== 'string' || typeof message !== 'string') return null;
  const cleanFields = Array.isArray(fields)
    ? fields.filter(
        (f): f is { path: string; message: string } =>
          typeof f === 'object' &&
          f !== null &&
          typeof (f as { path?: unknown }).path === 'string' &&
          typeof (f as { message?: unknown }).message === 'string',
      )
    : undefined;
  return { error: { code, message, ...(cleanFields ? { fields: cleanFields } : {}) } };
}

function fallbackMessage(status: number): string {
  if (status === 429) return 'Too many attempts. Wait a moment and try again.';
  if (status === 401) return 'Please sign in.';
  if (status === 403) return 'You do not have permission to do that.';
  if (status === 404) return 'Not found.';
  if (status >= 500) return 'The server had a problem. Try again in a moment.';
  return `The request failed (${status}).`;
}
