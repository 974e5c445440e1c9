/**
 * HTTP contract of accounts, teams and roles, shared by the server that serves it and the client
 * that calls it. Every route is under `/api`. Bodies are JSON. Errors use the API's one shape
 * (`ApiErrorBody`). State-changing routes need the CSRF token from `GET /api/auth/csrf` in the
 * `x-csrf-token` header.
 */

/** Team role of a member. A plan may override it per member. */
export type Role = 'owner' | 'editor' | 'reviewer' | 'viewer';

export const ROLES: readonly Role[] = ['owner', 'editor', 'reviewer', 'viewer'];

/**
 * Everything the policy decides (`server/domain/policy.ts`). `plan:manage-access` = set or clear
 * per-plan role overrides; `team:leave` = remove oneself from a team. `comment` and `approve` are known now so review and sign-off
 * fit later without changing the model.
 */
export type Action =
  | 'plan:read'
  | 'plan:create'
  | 'plan:edit'
  | 'plan:delete'
  | 'plan:comment'
  | 'plan:approve'
  | 'plan:manage-access'
  | 'team:read'
  | 'team:leave'
  | 'team:manage-members'
  | 'team:invite';

/** The API's one error shape. */
export interface ApiErrorBody {
  error: {
    code: string;
    message: string;
    fields?: Array<{ path: string; message: string }>;
  };
}

export interface UserDto {
  id: string;
  email: string;
  name: string;
}

export interface MembershipDto {
  teamId: string;
  teamName: string;
  role: Role;
}

/** `GET /api/auth/me` (401 when signed out). */
export interface MeResponse {
  user: UserDto;
  memberships: MembershipDto[];
}

/**
 * `POST /api/auth/register` (201) and `POST /api/auth/sign-in` (200). Signing in regenerates the
 * session, which drops the old CSRF token: use `csrfToken` from here for the next requests.
 */
export interface SignedInResponse extends MeResponse {
  csrfToken: string;
}

/** `GET /api/auth/csrf`. */
export interface CsrfResponse {
  token: string;
}

/** `POST /api/auth/register` → 201 `MeResponse`; `POST /api/auth/sign-in` → 200 `MeResponse`. */
export interface CredentialsRequest {
  email: string;
  password: string;
  name?: string;
}

/**
 * `POST /api/auth/password` (signed in) → 204. The session id is regenerated and the new CSRF
 * token is in the `x-csrf-token` response header; the user's other sessions end.
 */
export interface ChangePasswordRequest {
  currentPassword: string;
  newPassword: string;
}

/** `POST /api/auth/password-reset` → 202 always (no account enumeration). */
export interface PasswordResetRequest {
  email: string;
}

/**
 * `POST /api/auth/password-reset/confirm` → 204; 422 when the token is unknown, used or expired.
 * The mailed link is `<origin>/reset-password/<token>`. Every session of the user ends.
 */
export interface PasswordResetConfirmRequest {
  token: string;
  password: string;
}

export interface TeamDto {
  id: string;
  name: string;
  /** The caller's role in this team. */
  role: Role;
}

export interface MemberDto {
  userId: string;
  email: string;
  name: string;
  role: Role;
  joinedAt: string;
}

export interface InvitationDto {
  id: string;
  email: string;
  role: Role;
  invitedBy: string;
  expiresAt: string;
}

/**
 * `GET /api/teams` → `TeamDto[]`; `POST /api/teams` `{ name }` → 201 `TeamDto`;
 * `GET /api/teams/:teamId` → `TeamDto`. A team the caller is not a member of is a 404.
 */
export interface CreateTeamRequest {
  name: string;
}

/** `GET /api/teams/:teamId/members` → `MemberDto[]`. */
/** `PATCH /api/teams/:teamId/members/:userId` `{ role }` → 200 `MemberDto`. */
export interface ChangeRoleRequest {
  role: Role;
}
/**
 * `DELETE /api/teams/:teamId/members/:userId` → 204 (also: leave the team, userId = self).
 * The last owner can neither be demoted nor leave/be removed: 409 with a message saying so.
 */

/**
 * `POST /api/teams/:teamId/invitations` → 201 `InvitationDto` (mails a link to
 * `<origin>/invitations/<token>`); `GET` → open `InvitationDto[]`;
 * `DELETE /api/teams/:teamId/invitations/:invitationId` → 204 (withdraw). Owners only.
 */
export interface InviteRequest {
  email: string;
  role: Role;
}

/** `GET /api/invitations/:token` → what the invitation is, before accepting. */
export interface InvitationPreview {
  teamName: string;
  email: string;
  role: Role;
  invitedBy: string;
  expiresAt: string;
}
/**
 * `POST /api/invitations/:token/accept` (signed in as the invited address) → 200 `TeamDto`.
 * 403 with a message naming both addresses when signed in as someone else; 409 when already used,
 * expired or already a member; 404 when unknown or withdrawn.
 */

export interface PlanSummaryDto {
  id: string;
  slug: string;
  name: string;
  teamId: string;
  /** The caller's effective role on this plan (team role or per-plan override). */
  role: Role;
  updatedAt: string;
}
/** `GET /api/plans` → `PlanSummaryDto[]` (plans of the caller's teams). */
/** `POST /api/plans` `{ teamId, name }` → 201 `PlanSummaryDto`. */
/**
 * `GET /api/plans/:planId` → `PlanSummaryDto`; `PATCH /api/plans/:planId` `{ name }` → 200
 * `PlanSummaryDto` (editor, owner); `DELETE /api/plans/:planId` → 204 (owner).
 */
/**
 * `PUT /api/plans/:planId/roles/:userId` `{ role }` → 204: per-plan override (owner; role editor,
 * reviewer or viewer; team owners stay owners on every plan). `DELETE` the same path → 204 clears it.
 */

/** Every accounts/teams/plans route, `METHOD /api/path` (Express parameter syntax). */
export const ACCOUNTS_ROUTES = [
  'GET /api/auth/csrf',
  'POST /api/auth/register',
  'POST /api/auth/sign-in',
  'POST /api/auth/sign-out',
  'GET /api/auth/me',
  'POST /api/auth/password',
  'POST /api/auth/password-reset',
  'POST /api/auth/password-reset/confirm',
  'GET /api/teams',
  'POST /api/teams',
  'GET /api/teams/:teamId',
  'GET /api/teams/:teamId/members',
  'PATCH /api/teams/:teamId/members/:userId',
  'DELETE /api/teams/:teamId/members/:userId',
  'GET /api/teams/:teamId/invitations',
  'POST /api/teams/:teamId/invitations',
  'DELETE /api/teams/:teamId/invitations/:invitationId',
  'GET /api/invitations/:token',
  'POST /api/invitations/:token/accept',
  'GET /api/plans',
  'POST /api/plans',
  'GET /api/plans/:planId',
  'PATCH /api/plans/:planId',
  'DELETE /api/plans/:planId',
  'PUT /api/plans/:planId/roles/:userId',
  'DELETE /api/plans/:planId/roles/:userId',
] as const;

export type AccountsRoute = (typeof ACCOUNTS_ROUTES)[number];

/** Codes of the API's error shape. Statuses: 400 bad_request/validation_failed, 401, 403
 * forbidden/csrf_invalid, 404, 409, 413, 422, 429 rate_limited. */
export type ApiErrorCode =
  | 'bad_request'
  | 'validation_failed'
  | 'unauthenticated'
  | 'forbidden'
  | 'csrf_invalid'
  | 'not_found'
  | 'conflict'
  | 'payload_too_large'
  | 'unprocessable'
  | 'rate_limited'
  | 'service_unavailable'
  | 'internal';
