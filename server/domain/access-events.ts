import { EventEmitter } from 'node:events';

import type { Role } from '@rampart/collab/api/accounts';

/** What happened to someone's access, for live connections that must follow at once. */
export interface AccessEventMap {
  /** The user signed out, changed or reset their password: drop their live sockets. */
  signedOut: [userId: string];
  /**
   * The user's role in a team changed, or they left / were removed (`role` null): downgrade or
   * drop their sockets on that team's plans.
   */
  membershipChanged: [userId: string, teamId: string, role: Role | null];
  /** A per-plan override changed (`role` null = cleared): re-evaluate the user on that plan. */
  planRoleChanged: [userId: string, planId: string];
}

/** Name of the socket.io room every socket of one signed-in user joins. */
export function userRoom(userId: string): string {
  return `user:${userId}`;
}

/**
 * In-process notifications about access changes. One instance per application (created in the
 * composition root and passed in the deps), so tests never share listeners.
 */
export class AccessEvents {
  private readonly _emitter = new EventEmitter();

  on<K extends keyof AccessEventMap>(
    event: K,
    listener: (...args: AccessEventMap[K]) => void,
  ): () => void {
    this._emitter.on(event, listener as (...args: unknown[]) => void);
    return () => this._emitter.off(event, listener as (...args: unknown[]) => void);
  }

  emit<K extends keyof AccessEventMap>(event: K, ...args: AccessEventMap[K]): void {
    this._emitter.emit(event, ...args);
  }
}
