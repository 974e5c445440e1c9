import type { DataSource } from 'typeorm';

/**
 * The `sessions` table of connect-pg-simple, for the few things the store API cannot do:
 * ending every session of one user (password change and reset).
 */
export class SessionRepository {
  constructor(private readonly _ds: DataSource) {}

  /** Deletes every session signed in as `userId`, except `keepSid`. Resolves the count. */
  async deleteForUser(userId: string, keepSid?: string): Promise<number> {
    // passport keeps the serialized user at sess.passport.user.
    const result: [unknown[], number] = await this._ds.query(
      `DELETE FROM sessions WHERE sess -> 'passport' ->> 'user' = $1 AND sid <> $2`,
      [userId, keepSid ?? ''],
    );
    return result[1];
  }
}
