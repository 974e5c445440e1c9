import { parseEngineering } from '@rampart/collab/doc/engineering-notation';
import { readEntry } from '@rampart/collab/doc/doc-to-plan';
import { PlanEditError } from '@rampart/collab/doc/plan-edit-error';
import { setPartField, setPartValue, setTolerance } from '@rampart/collab/doc/part-ops';
import type { PartSpec, ToleranceSpec } from '@rampart/collab/engine/plan/plan-schema-parts';

import type { PlanSession } from '../../shared/plan-session/plan-session';
import type { PartFieldEdit } from './parts-table';

/** Outcome of one table edit: done, or the message to show under the field. */
export type PartEditResult = { ok: true } | { ok: false; error: string };

/**
 * Parses a parts-table entry and applies it as a named op. Bad input and refused edits come back
 * as messages naming the part and field; nothing reaches the document then.
 */
export function applyPartEdit(session: PlanSession, edit: PartFieldEdit): PartEditResult {
  try {
    if (edit.column === 'value') {
      const parsed = parseEngineering(edit.text);
      if (!parsed.ok) return { ok: false, error: `${edit.partId} ${edit.field}: ${parsed.error}` };
      const v = parsed.value;
      session.edit((doc, origin) =>
        edit.field === 'value'
          ? setPartValue(doc, origin, edit.partId, v)
          : setPartField(doc, origin, edit.partId, edit.field, v),
      );
      return { ok: true };
    }
    const text = edit.text.trim().replace(/%$/, '').trim();
    let tolerance: ToleranceSpec | undefined;
    if (text.length > 0) {
      const parsed = parseEngineering(text);
      if (!parsed.ok) return { ok: false, error: `${edit.partId} tolerance: ${parsed.error}` };
      // Keep the distribution a colleague may have chosen; only the percent changes here.
      const part = readEntry<PartSpec>(session.doc, 'parts', edit.partId);
      const previous =
        edit.field === 'value'
          ? (part as { tolerance?: ToleranceSpec } | undefined)?.tolerance
          : part?.tolerances?.[edit.field];
      tolerance = previous?.distribution
        ? { percent: parsed.value, distribution: previous.distribution }
        : { percent: parsed.value };
    }
    session.edit((doc, origin) => setTolerance(doc, origin, edit.partId, edit.field, tolerance));
    return { ok: true };
  } catch (err) {
    if (err instanceof PlanEditError) return { ok: false, error: err.message };
    throw err;
  }
}
