/**
 * First varuint of every `plan:sync` payload. The numbering is part of the wire contract: never
 * renumber, only append.
 */
export enum MessageType {
  /** A y-protocols sync message: step 1 (state vector), step 2 (missing updates) or update. */
  Sync = 0,
  /** A y-protocols awareness update (presence). */
  Awareness = 1,
}

/** Sub-type of a sync message, as numbered by y-protocols/sync. */
export enum SyncStep {
  /** "Here is my state vector; send me what I lack." Read-only. */
  Step1 = 0,
  /** "Here is what you lacked." A write. */
  Step2 = 1,
  /** "Here is a new local change." A write. */
  Update = 2,
}

/** Whether a sync sub-type changes the receiver's document. */
export function isWriteStep(step: SyncStep): boolean {
  return step === SyncStep.Step2 || step === SyncStep.Update;
}
