import type { Request } from 'express';
import { z } from 'zod';

import { ROLES } from '@rampart/collab/api/accounts';
import { AppError } from '../../errors/app-error';

/** bcrypt reads only the first 72 bytes of a password; longer ones would be silently cut. */
const BCRYPT_MAX_BYTES = 72;

export const emailField = z
  .string()
  .trim()
  .max(254, 'must be at most 254 characters')
  .toLowerCase()
  .pipe(z.email('must be an e-mail address'));

/** A new password: 10+ characters, at most 72 bytes (bcrypt's limit). */
export const newPasswordField = z
  .string()
  .min(10, 'must be at least 10 characters')
  .refine((p) => new TextEncoder().encode(p).length <= BCRYPT_MAX_BYTES, {
    message: `must be at most ${BCRYPT_MAX_BYTES} bytes`,
  });

const existingPasswordField = z.string().min(1, 'is required').max(200, 'is too long');
const nameField = z
  .string()
  .trim()
  .min(1, 'must not be empty')
  .max(120, 'must be at most 120 characters');
export const roleField = z.enum(ROLES as [string, ...string[]], {
  message: `must be one of ${ROLES.join(', ')}`,
}) as unknown as z.ZodType<(typeof ROLES)[number]>;

export const registerBody = z.object({
  email: emailField,
  password: newPasswordField,
  name: nameField.optional(),
});
export const signInBody = z.object({ email: emailField, password: existingPasswordField });
export const changePasswordBody = z.object({
  currentPassword: existingPasswordField,
  newPassword: newPasswordField,
});
export const resetRequestBody = z.object({ email: emailField });
export const resetConfirmBody = z.object({
  token: z.string().min(1, 'is required').max(200, 'is too long'),
  password: newPasswordField,
});
export const createTeamBody = z.object({ name: nameField });
export const changeRoleBody = z.object({ role: roleField });
export const inviteBody = z.object({ email: emailField, role: roleField });
export const createPlanBody = z.object({ teamId: z.uuid('must be a team id'), name: nameField });
export const renamePlanBody = z.object({ name: nameField });

/** Parses `req.body` with `schema`, or throws 400 `validation_failed` naming every bad field. */
export function parseBody<T>(schema: z.ZodType<T>, req: Request): T {
  const parsed = schema.safeParse(req.body ?? {});
  if (parsed.success) return parsed.data;
  const fields = parsed.error.issues.map((i) => ({
    path: i.path.join('.') || '(body)',
    message: i.message,
  }));
  const summary = fields.map((f) => `${f.path} ${f.message}`).join('; ');
  throw new AppError('validation_failed', `Invalid request: ${summary}`, fields);
}

const uuid = z.uuid();
const linkToken = z.string().regex(/^[A-Za-z0-9_-]{43}$/);

/**
 * A path id that must be a UUID. Anything else cannot name a row, so it is a 404 naming what
 * was looked up — and never reaches SQL (PostgreSQL would reject the cast with a 500).
 */
export function idParam(req: Request, name: string, what: string): string {
  const value = req.params[name];
  if (typeof value === 'string' && uuid.safeParse(value).success) return value;
  throw new AppError('not_found', `No such ${what}`);
}

/** A link token from the path (43 base64url characters), else 404. */
export function tokenParam(req: Request, what: string): string {
  const value = req.params['token'];
  if (typeof value === 'string' && linkToken.safeParse(value).success) return value;
  throw new AppError('not_found', `This ${what} link is not valid`);
}
