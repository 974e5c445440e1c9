import type { PasswordResetRepository } from '../data-access/repositories/password-reset-repository';
import type { SessionRepository } from '../data-access/repositories/session-repository';
import type { UserRecord, UserRepository } from '../data-access/repositories/user-repository';
import { AppError } from '../errors/app-error';
import type { Mailer } from '../mail/mailer';
import type { AccessEvents } from './access-events';
import {
  hashLinkToken,
  hashPassword,
  newLinkToken,
  timingDummyHash,
  verifyPassword,
} from './secrets';
import type { SignInThrottle } from './sign-in-throttle';

export interface AccountServiceDeps {
  users: UserRepository;
  resets: PasswordResetRepository;
  sessions: SessionRepository;
  mailer: Mailer;
  events: AccessEvents;
  throttle: SignInThrottle;
  bcryptCost: number;
  resetTtlMinutes: number;
}

/** Registration, sign-in checks, password change and reset by e-mailed one-time link. */
export class AccountService {
  private _dummyHash?: Promise<string>;

  constructor(private readonly _d: AccountServiceDeps) {}

  /** Creates an account; 409 when the e-mail is already registered. */
  async register(input: { email: string; password: string; name?: string }): Promise<UserRecord> {
    const email = input.email.toLowerCase();
    const passwordHash = await hashPassword(input.password, this._d.bcryptCost);
    const name = input.name?.trim() || email.split('@')[0] || email;
    const user = await this._d.users.create({ email, name, passwordHash });
    if (!user) {
      throw new AppError('conflict', 'An account with this e-mail already exists', [
        { path: 'email', message: 'already registered; sign in or reset the password' },
      ]);
    }
    return user;
  }

  /**
   * The user whose e-mail and password these are. 401 on a wrong pair (same message either
   * way, so addresses cannot be probed); 429 while the account's failure delay runs.
   */
  async verifyCredentials(emailInput: string, password: string): Promise<UserRecord> {
    const email = emailInput.toLowerCase();
    const waitMs = this._d.throttle.waitMs(email);
    if (waitMs > 0) {
      throw new AppError(
        'rate_limited',
        `Too many failed sign-ins for this account; try again in ${Math.ceil(waitMs / 1000)} s`,
      );
    }
    const user = await this._d.users.findCredentialsByEmail(email);
    const ok = await verifyPassword(password, user?.passwordHash ?? (await this._dummy()));
    if (!user || !ok) {
      this._d.throttle.recordFailure(email);
      throw new AppError('unauthenticated', 'E-mail or password is wrong');
    }
    this._d.throttle.recordSuccess(email);
    const { passwordHash: _h, ...record } = user;
    return record;
  }

  /** Changes the password after checking the current one; ends the user's other sessions. */
  async changePassword(
    userId: string,
    currentPassword: string,
    newPassword: string,
    currentSid: string,
  ): Promise<void> {
    const user = await this._d.users.findCredentialsById(userId);
    if (!user) throw new AppError('unauthenticated', 'Sign in first');
    if (!(await verifyPassword(currentPassword, user.passwordHash))) {
      throw new AppError('validation_failed', 'The current password is wrong', [
        { path: 'currentPassword', message: 'does not match' },
      ]);
    }
    await this._d.users.updatePasswordHash(
      userId,
      await hashPassword(newPassword, this._d.bcryptCost),
    );
    await this._d.sessions.deleteForUser(userId, currentSid);
    this._d.events.emit('signedOut', userId);
  }

  /**
   * Mails a one-time reset link when the address has an account. Says nothing either way (the
   * route always answers 202), so the form cannot be used to find registered addresses.
   */
  async requestReset(emailInput: string, origin: string): Promise<void> {
    const user = await this._d.users.findCredentialsByEmail(emailInput);
    if (!user) return;
    const { token, hash } = newLinkToken();
    const expiresAt = new Date(Date.now() + this._d.resetTtlMinutes * 60_000);
    await this._d.resets.create(user.id, hash, expiresAt);
    const link = `${origin}/reset-password/${token}`;
    await this._d.mailer.send({
      to: user.email,
      subject: 'Reset your Rampart password',
      text: [
        `Hello ${user.name},`,
        '',
        'Someone (hopefully you) asked to reset the password of this Rampart account.',
        `Open this link within ${this._d.resetTtlMinutes} minutes to choose a new one:`,
        '',
        link,
        '',
        'The link works once. If you did not ask for it, ignore this mail.',
      ].join('\n'),
    });
  }

  /** Sets a new password from a reset link; every session of that user ends. */
  async confirmReset(token: string, password: string): Promise<void> {
    const hash = await hashPassword(password, this._d.bcryptCost);
    const userId = await this._d.resets.consume(hashLinkToken(token), hash, new Date());
    if (!userId) {
      throw new AppError(
        'unprocessable',
        'This reset link is invalid, already used or expired; ask for a new one',
        [{ path: 'token', message: 'invalid, used or expired' }],
      );
    }
    await this._d.sessions.deleteForUser(userId);
    this._d.throttle.recordSuccess((await this._d.users.findById(userId))?.email ?? '');
    this._d.events.emit('signedOut', userId);
  }

  private _dummy(): Promise<string> {
    this._dummyHash ??= timingDummyHash(this._d.bcryptCost);
    return this._dummyHash;
  }
}
