/** Named error for an edit the plan cannot take (unknown id, bad value, dangling reference). */

/** What an edit was aimed at, for messages and the audit trail. */
export type EditTargetKind =
  'plan' | 'net' | 'part' | 'signal' | 'requirement' | 'scenario' | 'settings' | 'intent';

/**
 * An edit was refused before touching the document. The message always names the part, net,
 * signal, requirement or field at fault, e.g. `part R4: value must be > 0`.
 */
export class PlanEditError extends Error {
  readonly target: EditTargetKind;
  readonly targetId: string;
  readonly field: string | undefined;

  constructor(target: EditTargetKind, targetId: string, message: string, field?: string) {
    super(`${target} ${targetId}${field === undefined ? '' : ` ${field}`}: ${message}`);
    this.name = 'PlanEditError';
    this.target = target;
    this.targetId = targetId;
    this.field = field;
  }
}

/** The document's layout is newer than this code understands, or is damaged. */
export class DocSchemaError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'DocSchemaError';
  }
}
