import { formatEngineering } from '@rampart/collab/doc/engineering-notation';
import type { PartSpec, ToleranceSpec } from '@rampart/collab/engine/plan/plan-schema-parts';

/** One row of the parts table: the part's main editable number and its tolerance. */
export interface PartRow {
  id: string;
  kind: string;
  label: string;
  /** Field the value column edits (`value`, `vout`, `threshold`), or null when none. */
  field: string | null;
  unit: string;
  /** Formatted value for the input (`100 k`), '' when no field. */
  valueText: string;
  /** Tolerance in percent as text (`1`), '' when none or given as min/max. */
  toleranceText: string;
  /** Tolerance given as absolute min/max, shown instead of a percent. */
  toleranceRange: string | null;
}

const MAIN: Readonly<Record<string, { field: string; unit: string }>> = {
  resistor: { field: 'value', unit: 'Ω' },
  capacitor: { field: 'value', unit: 'F' },
  inductor: { field: 'value', unit: 'H' },
  vsource: { field: 'value', unit: 'V' },
  isource: { field: 'value', unit: 'A' },
  regulator: { field: 'vout', unit: 'V' },
  comparator: { field: 'threshold', unit: 'V' },
};

function toleranceOf(part: PartSpec, field: string): ToleranceSpec | undefined {
  if (field === 'value') return (part as { tolerance?: ToleranceSpec }).tolerance;
  return part.tolerances?.[field];
}

/** Table rows for the parts of a plan. */
export function partRows(parts: readonly PartSpec[]): PartRow[] {
  return parts.map((part) => {
    const main = MAIN[part.kind];
    const raw = main ? (part as unknown as Record<string, unknown>)[main.field] : undefined;
    const tol = main ? toleranceOf(part, main.field) : undefined;
    return {
      id: part.id,
      kind: part.kind,
      label: part.label ?? '',
      field: main?.field ?? null,
      unit: main?.unit ?? '',
      // The unit is shown beside the input, so the text carries only number and prefix.
      valueText: typeof raw === 'number' ? formatEngineering(raw, '', 4) : '',
      toleranceText: tol?.percent !== undefined ? String(tol.percent) : '',
      toleranceRange:
        tol && tol.min !== undefined && tol.max !== undefined
          ? `${formatEngineering(tol.min, main?.unit ?? '')} … ${formatEngineering(tol.max, main?.unit ?? '')}`
          : null,
    };
  });
}
