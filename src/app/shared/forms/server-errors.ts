import { FormGroup } from '@angular/forms';

import type { ApiProblem } from '../api/api-error';

/**
 * Puts the server's field messages onto the matching controls (error key `server`, shown by
 * `fieldMessage`), marks them touched so they show at once, and returns what is left for the
 * form-level message: the problem's sentence, unless every field message found a control.
 * The `server` error goes away by itself on the next edit, because Angular re-runs the
 * validators and replaces the control's errors.
 */
export function applyServerErrors(form: FormGroup, problem: ApiProblem): string | null {
  let unmatched = false;
  for (const [path, message] of Object.entries(problem.fields)) {
    const control = form.get(path);
    if (!control) {
      unmatched = true;
      continue;
    }
    control.setErrors({ ...(control.errors ?? {}), server: message });
    control.markAsTouched();
  }
  const matchedAll = Object.keys(problem.fields).length > 0 && !unmatched;
  return matchedAll ? null : problem.message;
}
