import { IsNull, MoreThan, type DataSource } from 'typeorm';

import { PasswordResetTokenEntity } from '../entities/password-reset-token.entity';
import { UserEntity } from '../entities/user.entity';

/** Password-reset tokens, by the SHA-256 of the token. */
export class PasswordResetRepository {
  constructor(private readonly _ds: DataSource) {}

  async create(userId: string, tokenHash: string, expiresAt: Date): Promise<void> {
    await this._ds.getRepository(PasswordResetTokenEntity).insert({ userId, tokenHash, expiresAt });
  }

  /**
   * Uses the token (once, only before it expires) and sets the new password hash in the same
   * transaction. Resolves the user id, or null when the token is unknown, used or expired.
   * Every other open token of that user is spent too, so an older mail stops working.
   */
  consume(tokenHash: string, passwordHash: string, now: Date): Promise<string | null> {
    return this._ds.transaction(async (m) => {
      const token = await m.findOneBy(PasswordResetTokenEntity, {
        tokenHash,
        usedAt: IsNull(),
        expiresAt: MoreThan(now),
      });
      if (!token) return null;
      const spent = await m.update(
        PasswordResetTokenEntity,
        { userId: token.userId, usedAt: IsNull() },
        { usedAt: now },
      );
      if (!spent.affected) return null;
      await m.update(UserEntity, { id: token.userId }, { passwordHash });
      return token.userId;
    });
  }
}
