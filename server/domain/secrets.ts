import { createHash, randomBytes } from 'node:crypto';

import bcrypt from 'bcryptjs';

/** A fresh one-time token for a link, and the SHA-256 that is stored instead of it. */
export function newLinkToken(): { token: string; hash: string } {
  // 32 random bytes: guessing is hopeless, so a fast hash is enough to store it (unlike
  // passwords, which need bcrypt's slowness) — common practice, no source.
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashLinkToken(token) };
}

/** SHA-256 (hex) of a link token, as stored. */
export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

/**
 * Compared against when the e-mail is unknown, so a sign-in for a missing account costs as long
 * as one for a real account and does not reveal which addresses are registered.
 */
export function timingDummyHash(cost: number): Promise<string> {
  return bcrypt.hash('rampart-timing-dummy', cost);
}
