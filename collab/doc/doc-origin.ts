/**
 * Transaction origins of a plan document. Every write to a plan doc names where it came from, so
 * the undo manager tracks only this user's edits, the session sends only local changes, and the
 * server does not re-store what it has just loaded.
 */

/** An edit made in this tab by one user. One object per session: undo tracks it by identity. */
export interface LocalOrigin {
  readonly kind: 'local';
  /** Account id of the editing user (for the audit trail). */
  readonly userId: string;
  /** Display name, when known, for edit descriptions. */
  readonly userName?: string;
}

/** An update received from the relay (another user's edit). */
export interface RemoteOrigin {
  readonly kind: 'remote';
}

/** State loaded from storage (PostgreSQL on the server, the browser's offline copy on a client). */
export interface PersistenceOrigin {
  readonly kind: 'persistence';
}

export type DocOrigin = LocalOrigin | RemoteOrigin | PersistenceOrigin;

/** The one remote origin object: updates applied from the wire. */
export const REMOTE_ORIGIN: RemoteOrigin = Object.freeze({ kind: 'remote' });

/** The one persistence origin object: loads and migrations of stored state. */
export const PERSISTENCE_ORIGIN: PersistenceOrigin = Object.freeze({ kind: 'persistence' });

/**
 * A fresh local origin for one editing session. Keep the returned object: the undo manager and
 * the unsent-edit tracking compare origins by identity.
 */
export function localOrigin(userId: string, userName?: string): LocalOrigin {
  if (userId.length === 0) throw new TypeError('localOrigin: userId must not be empty');
  return Object.freeze(
    userName === undefined ? { kind: 'local', userId } : { kind: 'local', userId, userName },
  );
}

/** Whether a transaction origin is one of ours (Yjs origins are `unknown`). */
export function isDocOrigin(origin: unknown): origin is DocOrigin {
  if (origin === null || typeof origin !== 'object') return false;
  const kind = (origin as { kind?: unknown }).kind;
  if (kind === 'remote' || kind === 'persistence') return true;
  return kind === 'local' && typeof (origin as { userId?: unknown }).userId === 'string';
}

/** Whether a transaction origin is a local user edit. */
export function isLocalOrigin(origin: unknown): origin is LocalOrigin {
  return isDocOrigin(origin) && origin.kind === 'local';
}
