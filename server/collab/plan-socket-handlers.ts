import { applyAwarenessUpdate } from 'y-protocols/awareness';

import type { Role } from '@rampart/collab/api/accounts';
import { encodeStateInChunks } from '@rampart/collab/sync/chunk-state';
import type { SyncError, SyncErrorCode } from '@rampart/collab/sync/errors';
import type { JoinResult, Response, SyncAck } from '@rampart/collab/sync/events';
import { MAX_ROOMS_PER_SOCKET, MAX_SYNC_CHUNK_BYTES } from '@rampart/collab/sync/limits';
import { MessageType, SyncStep } from '@rampart/collab/sync/message-type';
import { isReadOnlyRole } from '@rampart/collab/sync/read-only-roles';
import { addsNothing } from '@rampart/collab/sync/update-news';
import {
  decodePlanMessage,
  toWire,
  encodeAwareness,
  encodeStep2Update,
  encodeSyncStep1,
  type AwarenessEntry,
} from '@rampart/collab/sync/wire-codec';

import type { PlanDocumentRepository } from '../data-access/repositories/plan-document-repository';
import type { Logger } from '../logger';
import { AwarenessThrottle } from './awareness-throttle';
import type { CollabOptions } from './collab-options';
import type { Authorize, PlanSocket } from './collab-types';
import type { PlanRoom } from './plan-room';
import { RoomUnavailableError, type RoomRegistry } from './room-registry';
import { TokenBucket } from './token-bucket';

/** socket.io room name of a plan. */
export function roomKey(planId: string): string {
  return `plan:${planId}`;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** What the relay remembers about one connected socket. */
export interface SocketSession {
  socket: PlanSocket;
  joined: Map<string, { role: Role; readOnly: boolean }>;
  bucket: TokenBucket;
  throttle: AwarenessThrottle;
  lastRateNotice: number;
}

export interface HandlerDeps {
  registry: RoomRegistry;
  repo: PlanDocumentRepository;
  authorize: Authorize;
  options: CollabOptions;
  log: Logger;
}

const MESSAGES: Record<SyncErrorCode, string> = {
  unauthenticated: 'Sign in to open live plans.',
  origin_denied: 'This page may not open a live plan.',
  forbidden: 'You do not have access to this plan.',
  read_only: 'Your role on this plan is read-only; the change was not saved.',
  not_found: 'No plan has this id.',
  not_joined: 'Join the plan before sending changes to it.',
  malformed: 'The message could not be read.',
  too_large: 'The message is too large.',
  rate_limited: 'Too many messages; some were dropped.',
  too_many_rooms: `At most ${MAX_ROOMS_PER_SOCKET} plans can be open on one connection.`,
  unavailable: 'The plan is not available right now; try again.',
  internal: 'Something went wrong on the server.',
};

function fail(code: SyncErrorCode, detail?: string): { error: SyncError } {
  return { error: { code, message: detail ? `${MESSAGES[code]} (${detail})` : MESSAGES[code] } };
}

function noAck(): void {}

/**
 * Registers the live-plan events of one socket. Every handler validates its input, answers
 * through the ack or an error event with a whitelisted code, and never throws into socket.io.
 */
export function registerPlanHandlers(
  socket: PlanSocket,
  deps: HandlerDeps,
  sessions: Map<string, SocketSession>,
): SocketSession {
  const { registry, repo, authorize, options, log } = deps;
  const who = () => `socket ${socket.id} (user ${socket.data.userId})`;
  const session: SocketSession = {
    socket,
    joined: new Map(),
    bucket: new TokenBucket(options.messagesPerSecond, options.messageBurst),
    throttle: new AwarenessThrottle(options.awarenessPerSecond, (planId, update) => {
      const room = registry.get(planId);
      if (room && session.joined.has(planId)) {
        applyAwarenessUpdate(room.awareness, update, { kind: 'remote', socketId: socket.id });
      }
    }),
    lastRateNotice: 0,
  };
  sessions.set(socket.id, session);

  const reject = (
    planId: string | null,
    code: SyncErrorCode,
    detail: string,
  ): { error: SyncError } => {
    log.warn(`[collab] ${who()} plan ${planId ?? '-'}: ${code}: ${detail}`);
    const res = fail(code, detail);
    socket.emit('plan:message-rejected', planId, res.error);
    return res;
  };

  socket.on('plan:join', (planId: unknown, ack: unknown) => {
    const reply = typeof ack === 'function' ? (ack as (r: Response<JoinResult>) => void) : noAck;
    void join(planId).then(reply, (err: unknown) => {
      log.error(`[collab] ${who()}: join failed`, err);
      reply(fail('internal'));
    });
  });

  socket.on('plan:leave', (planId: unknown, ack: unknown) => {
    const reply =
      typeof ack === 'function' ? (ack as (r: Response<{ planId: string }>) => void) : noAck;
    if (typeof planId !== 'string' || !session.joined.has(planId)) {
      reply(fail('not_joined'));
      return;
    }
    leaveRoom(session, planId, registry);
    reply({ data: { planId } });
  });

  socket.on('plan:sync', (planId: unknown, payload: unknown, ack: unknown) => {
    const reply = typeof ack === 'function' ? (ack as (r: Response<SyncAck>) => void) : noAck;
    void sync(planId, payload).then(reply, (err: unknown) => {
      log.error(`[collab] ${who()}: sync failed`, err);
      reply(fail('internal'));
    });
  });

  socket.on('disconnect', () => {
    session.throttle.cancel();
    for (const planId of session.joined.keys()) registry.release(planId, socket.id);
    session.joined.clear();
    sessions.delete(socket.id);
  });

  async function join(planId: unknown): Promise<Response<JoinResult>> {
    if (typeof planId !== 'string' || !UUID.test(planId)) {
      return reject(null, 'not_found', 'plan id must be a uuid');
    }
    const existing = session.joined.get(planId);
    if (existing) {
      const room = registry.get(planId);
      if (room) sendInitial(room);
      return { data: { planId, ...existing } };
    }
    if (session.joined.size >= MAX_ROOMS_PER_SOCKET) {
      return reject(planId, 'too_many_rooms', `${session.joined.size} open`);
    }
    let role: Role | null;
    try {
      if (!(await repo.planExists(planId))) return reject(planId, 'not_found', 'unknown plan');
      role = await authorize(socket.data.userId, planId);
    } catch (err) {
      log.error(`[collab] ${who()} plan ${planId}: access check failed`, err);
      return fail('unavailable', 'access could not be checked');
    }
    if (role === null) return reject(planId, 'forbidden', 'not a member');
    let room: PlanRoom;
    try {
      room = await registry.acquire(planId, socket.id);
    } catch (err) {
      if (err instanceof RoomUnavailableError) return fail('unavailable', err.message);
      throw err;
    }
    if (!socket.connected) {
      registry.release(planId, socket.id);
      return fail('unavailable', 'disconnected while joining');
    }
    const membership = { role, readOnly: isReadOnlyRole(role) };
    session.joined.set(planId, membership);
    await socket.join(roomKey(planId));
    // The ack goes first so the client knows its role before the first sync bytes arrive.
    setImmediate(() => sendInitial(room));
    return { data: { planId, ...membership } };
  }

  /** The server's sync step 1 and everyone's presence: the client answers with its step 2. */
  function sendInitial(room: PlanRoom): void {
    if (room.phase !== 'ready') return;
    socket.emit('plan:synced', room.planId, toWire(encodeSyncStep1(room.doc)));
    const ids = [...room.awareness.getStates().keys()];
    if (ids.length > 0)
      socket.emit('plan:synced', room.planId, toWire(encodeAwareness(room.awareness, ids)));
  }

  async function sync(planId: unknown, payload: unknown): Promise<Response<SyncAck>> {
    const now = Date.now();
    if (!session.bucket.take(now)) {
      // Tell the client at most once a second; a flood must not cost an event per message.
      if (now - session.lastRateNotice > 1000) {
        session.lastRateNotice = now;
        return reject(
          typeof planId === 'string' ? planId : null,
          'rate_limited',
          'per-socket limit',
        );
      }
      return fail('rate_limited');
    }
    if (typeof planId !== 'string') return reject(null, 'malformed', 'plan id must be a string');
    const membership = session.joined.get(planId);
    if (!membership) return reject(planId, 'not_joined', 'not joined');
    const room = registry.get(planId);
    if (!room) return reject(planId, 'unavailable', 'room not open');
    const decoded = decodePlanMessage(payload);
    if (!decoded.ok) return reject(planId, decoded.code, decoded.reason);
    const message = decoded.message;
    if (message.type === MessageType.Awareness) {
      const problem = checkAwarenessOwner(room, message.entries);
      if (problem) return reject(planId, 'malformed', problem);
      session.throttle.submit(planId, message.update);
      return { data: { stored: [] } };
    }
    if (message.step === SyncStep.Step1) {
      for (const chunk of encodeStateInChunks(
        room.doc,
        message.stateVector,
        MAX_SYNC_CHUNK_BYTES,
      )) {
        socket.emit('plan:synced', planId, toWire(encodeStep2Update(chunk)));
      }
      socket.emit('plan:loaded', planId);
      return { data: { stored: [] } };
    }
    // Repeats (a reconnecting peer's step 2) are neither stored nor denied.
    if (addsNothing(room.doc, message.update)) return { data: { stored: [] } };
    if (membership.readOnly) {
      log.warn(`[collab] ${who()} plan ${planId}: update from ${membership.role} dropped`);
      const res = fail('read_only', membership.role);
      socket.emit('plan:update-denied', planId, res.error);
      return res;
    }
    const seq = await registry.store(room, message.update, socket.data.userId, socket.id);
    return { data: { stored: [seq] } };
  }

  /**
   * A socket may only set presence for awareness clients it introduced, and only as its own
   * user: otherwise one client could hide or impersonate another.
   */
  function checkAwarenessOwner(room: PlanRoom, entries: AwarenessEntry[]): string | null {
    const mine = room.members.get(socket.id);
    if (!mine) return 'not a member of the room';
    for (const entry of entries) {
      for (const [otherId, clients] of room.members) {
        if (otherId !== socket.id && clients.has(entry.clientId)) {
          return `presence client ${entry.clientId} belongs to another connection`;
        }
      }
      const state = entry.state as { user?: { id?: unknown } } | null;
      if (state !== null && state.user?.id !== socket.data.userId) {
        return 'presence user.id must be the signed-in user';
      }
    }
    for (const entry of entries) mine.add(entry.clientId);
    return null;
  }

  return session;
}

/** Takes a socket out of a plan: room membership, presence, pending presence updates. */
export function leaveRoom(session: SocketSession, planId: string, registry: RoomRegistry): void {
  session.joined.delete(planId);
  session.throttle.cancel(planId);
  void session.socket.leave(roomKey(planId));
  registry.release(planId, session.socket.id);
}
