import type { Role } from '../api/accounts';

/**
 * Whether a role may only watch a plan live (document and presence in, no document updates
 * out). The accounts policy decides who may join; this decides what a joined socket may send.
 */
export function isReadOnlyRole(role: Role): boolean {
  return role === 'viewer' || role === 'reviewer';
}
