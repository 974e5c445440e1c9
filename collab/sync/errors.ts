/**
 * Error codes the live-plan relay may send. Only these leave the server; anything unexpected is
 * reported as `internal` with a generic message.
 */
export const SYNC_ERROR_CODES = [
  /** The socket has no signed-in user, or the session ended. */
  'unauthenticated',
  /** The socket's page origin is not the server's own. */
  'origin_denied',
  /** The user may not read this plan (not a member, or access revoked). */
  'forbidden',
  /** The user may read the plan but not change it (viewer, reviewer). */
  'read_only',
  /** No plan has this id. */
  'not_found',
  /** A message for a plan the socket has not joined. */
  'not_joined',
  /** The bytes are not a valid sync or awareness message. */
  'malformed',
  /** The message exceeds a size limit (see `limits.ts`). */
  'too_large',
  /** The socket sent too many messages; the extra ones were dropped. */
  'rate_limited',
  /** Joined too many plans at once. */
  'too_many_rooms',
  /** The plan is still loading or the database is unreachable; try again. */
  'unavailable',
  /** Something failed on the server; nothing about it is shown. */
  'internal',
] as const;

export type SyncErrorCode = (typeof SYNC_ERROR_CODES)[number];

/** The error half of `Response<T>`, and the payload of error events. */
export interface SyncError {
  code: SyncErrorCode;
  /** A sentence safe to show to the user. */
  message: string;
}

/** Whether `code` is one of the whitelisted codes. */
export function isSyncErrorCode(code: unknown): code is SyncErrorCode {
  return typeof code === 'string' && (SYNC_ERROR_CODES as readonly string[]).includes(code);
}
