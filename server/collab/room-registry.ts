import {
  applyAwarenessUpdate,
  encodeAwarenessUpdate,
  removeAwarenessStates,
} from 'y-protocols/awareness';
import * as Y from 'yjs';

import type { PlanDocumentRepository } from '../data-access/repositories/plan-document-repository';
import type { Logger } from '../logger';
import type { CollabOptions } from './collab-options';
import { PlanRoom, type RelayOrigin } from './plan-room';
import { UpdateWriter, type StoredItem } from './update-writer';

/** How the registry tells the socket layer about changes it must fan out. */
export interface RoomEvents {
  /** A room's doc changed: send `update` to the room's local sockets except `exceptSocketId`. */
  docUpdated(planId: string, update: Uint8Array, exceptSocketId: string | undefined): void;
  /**
   * Presence changed: send the awareness update to the room's local sockets; unless `relayed`
   * (it came from another process), also to the other processes.
   */
  awarenessUpdated(
    planId: string,
    update: Uint8Array,
    exceptSocketId: string | undefined,
    relayed: boolean,
  ): void;
  /** An update this process stored: tell the other processes. */
  stored(planId: string, update: Uint8Array, seq: number): void;
}

/** Thrown by `acquire` when the plan's document cannot be loaded now. */
export class RoomUnavailableError extends Error {
  override readonly name = 'RoomUnavailableError';
}

/**
 * The open rooms of one server process, created in the composition root (never a module
 * global, so every test server has its own). Loads a room before anyone is served from it,
 * stores every accepted update before it is relayed, compacts the log, heals missed relays from
 * PostgreSQL, and unloads a room only when nothing about it is in flight.
 */
export class RoomRegistry {
  private readonly rooms = new Map<string, PlanRoom>();
  private readonly antiEntropyTimer: ReturnType<typeof setInterval>;
  private antiEntropyRunning = false;
  private closing = false;

  constructor(
    private readonly repo: PlanDocumentRepository,
    private readonly options: CollabOptions,
    private readonly log: Logger,
    private readonly events: RoomEvents,
  ) {
    this.antiEntropyTimer = setInterval(() => void this.antiEntropy(), options.antiEntropyMs);
    this.antiEntropyTimer.unref();
  }

  /** Open rooms (for benchmarks and tests). */
  get size(): number {
    return this.rooms.size;
  }

  /** Whether `planId` has a room in this process in any phase (loading, ready, closing). */
  has(planId: string): boolean {
    return this.rooms.has(planId);
  }

  /** The open, loaded room of `planId`, if any. */
  get(planId: string): PlanRoom | undefined {
    const room = this.rooms.get(planId);
    return room && room.phase === 'ready' ? room : undefined;
  }

  /**
   * The room of `planId` with `socketId` counted as a member, loaded from storage first. A
   * socket that joins while the room loads waits for the load; it is never served an empty doc.
   */
  async acquire(planId: string, socketId: string): Promise<PlanRoom> {
    if (this.closing) throw new RoomUnavailableError('the server is shutting down');
    for (let attempt = 0; attempt < 5; attempt++) {
      let room = this.rooms.get(planId);
      if (room && (room.phase === 'closing' || room.phase === 'closed')) {
        await room.closed;
        continue;
      }
      if (!room) room = this.open(planId);
      try {
        await room.ready;
      } catch (err) {
        throw new RoomUnavailableError(`plan ${planId} could not be loaded`, { cause: err });
      }
      if (room.phase !== 'ready') continue;
      if (room.closeTimer) {
        clearTimeout(room.closeTimer);
        room.closeTimer = null;
      }
      if (!room.members.has(socketId)) room.members.set(socketId, new Set());
      return room;
    }
    throw new RoomUnavailableError(`plan ${planId} is closing; try again`);
  }

  /** Removes a socket from a room: its presence goes at once, the room closes when empty. */
  release(planId: string, socketId: string): void {
    const room = this.rooms.get(planId);
    if (!room) return;
    const clients = room.members.get(socketId);
    room.members.delete(socketId);
    if (clients && clients.size > 0) {
      removeAwarenessStates(room.awareness, [...clients], { kind: 'remote', socketId });
    }
    if (room.members.size === 0 && room.phase === 'ready' && !room.closeTimer) {
      room.closeTimer = setTimeout(() => {
        room.closeTimer = null;
        if (room.members.size === 0) void this.close(room);
      }, this.options.roomCloseDelayMs);
    }
  }

  /**
   * Accepts a validated update from a socket: resolves with its seq after COMMIT (the sender is
   * acknowledged only then). With `relayBeforeCommit` the room's doc, and so the other local
   * sockets, get it at once; the durable copy follows. That is safe with a CRDT: until the
   * commit the sender holds the update unacknowledged and sends it again after a reconnect,
   * and every editor that received it would include it in its own step 2 as well.
   */
  store(
    room: PlanRoom,
    update: Uint8Array,
    authorId: string | null,
    socketId?: string,
  ): Promise<number> {
    if (this.options.relayBeforeCommit) this.applyAccepted(room, update, socketId);
    return room.writer.enqueue({ update, authorId, socketId });
  }

  /**
   * An update stored without an open room here (e.g. a snapshot restored through the API on a
   * process that holds no socket of the plan): tell the other processes, whose rooms apply and
   * relay it at once instead of at their next anti-entropy pass.
   */
  announceStored(planId: string, update: Uint8Array, seq: number): void {
    this.events.stored(planId, update, seq);
  }

  /** Presence from another process: apply it to this process's copy of the room. */
  presenceRelayed(planId: string, update: Uint8Array): void {
    const room = this.get(planId);
    if (!room) return;
    try {
      applyAwarenessUpdate(room.awareness, update, { kind: 'remote', relayed: true });
    } catch (err) {
      this.log.warn(`[collab] plan ${planId}: relayed presence could not be applied`, err);
    }
  }

  /** An update another process stored: apply it to this process's copy, if the room is open. */
  relayed(planId: string, update: Uint8Array, seq: number): void {
    const room = this.get(planId);
    if (!room) return;
    try {
      room.applyUpdate(update, seq, { kind: 'remote', relayed: true });
    } catch (err) {
      this.log.warn(`[collab] plan ${planId}: relayed update ${seq} could not be applied`, err);
    }
  }

  /**
   * Anti-entropy: one query for where every open plan's log stands, then a reload of each room
   * that misses stored updates (a relay the adapter dropped, e.g. while its listening
   * connection reconnected). Returns how many rooms were reloaded.
   */
  async antiEntropy(): Promise<number> {
    if (this.antiEntropyRunning || this.closing) return 0;
    this.antiEntropyRunning = true;
    try {
      const open = [...this.rooms.values()].filter((r) => r.phase === 'ready');
      if (open.length === 0) return 0;
      const heads = await this.repo.heads(open.map((r) => r.planId));
      let healed = 0;
      for (const room of open) {
        const head = heads.get(room.planId);
        if (!head || !room.isBehind(head.lastSeq) || room.phase !== 'ready') continue;
        const stored = await this.repo.load(room.planId);
        if (room.phase !== 'ready') continue;
        room.applyStored(stored);
        healed++;
      }
      if (healed > 0) this.log.info(`[collab] anti-entropy reloaded ${healed} room(s)`);
      return healed;
    } catch (err) {
      this.log.warn('[collab] anti-entropy pass failed; next pass retries', err);
      return 0;
    } finally {
      this.antiEntropyRunning = false;
    }
  }

  /**
   * Stores, compacts and unloads every room (process shutdown). If storage stays unreachable
   * for `timeoutMs`, the writers stop and what they held is logged as unstored: those updates
   * were never acknowledged, so their senders still hold them and resend them on reconnect.
   */
  async closeAll(timeoutMs = 10_000): Promise<void> {
    this.closing = true;
    clearInterval(this.antiEntropyTimer);
    const all = Promise.all([...this.rooms.values()].map((room) => this.close(room)));
    let timer: ReturnType<typeof setTimeout> | undefined;
    const timedOut = await Promise.race([
      all.then(() => false),
      new Promise<boolean>((r) => (timer = setTimeout(() => r(true), timeoutMs))),
    ]);
    clearTimeout(timer);
    if (!timedOut) return;
    for (const room of this.rooms.values()) {
      const left = room.writer.stop();
      if (left > 0) {
        this.log.error(`[collab] plan ${room.planId}: ${left} unacknowledged update(s) not stored`);
      }
      room.destroy();
    }
    this.rooms.clear();
  }

  /** Compacts a room's log now (also used by benchmarks and tests). */
  compactNow(room: PlanRoom): Promise<void> {
    const job = this.repo
      .compact(room.planId)
      .then(() => {
        room.logCount = 0;
        room.logBytes = 0;
      })
      .catch((err: unknown) => {
        this.log.warn(`[collab] plan ${room.planId}: compaction failed; the log is kept`, err);
      })
      .finally(() => room.inFlight.delete(job));
    room.inFlight.add(job);
    return job;
  }

  private open(planId: string): PlanRoom {
    const room = new PlanRoom(planId);
    room.writer = new UpdateWriter(
      `plan ${planId}`,
      (items) => this.repo.append(planId, items),
      this.options,
      this.log,
      (items) => this.afterStore(room, items),
    );
    room.doc.on('update', (update: Uint8Array, origin: unknown) => {
      // Loads and reloads change the doc too: what they add is news for the local sockets.
      const except = (origin as RelayOrigin | null)?.socketId;
      this.events.docUpdated(planId, update, except);
    });
    room.awareness.on(
      'update',
      (change: { added: number[]; updated: number[]; removed: number[] }, origin: unknown) => {
        const ids = [...change.added, ...change.updated, ...change.removed];
        if (ids.length === 0) return;
        const relay = origin as RelayOrigin | null;
        const bytes = encodeAwarenessUpdate(room.awareness, ids);
        this.events.awarenessUpdated(planId, bytes, relay?.socketId, relay?.relayed === true);
      },
    );
    room.ready = this.repo.load(planId).then(
      (stored) => {
        if (room.phase !== 'loading') return;
        room.applyStored(stored);
        room.logCount = stored.updates.length;
        room.logBytes = stored.updates.reduce((n, u) => n + u.update.byteLength, 0);
        room.phase = 'ready';
        if (this.shouldCompact(room)) void this.compactNow(room);
      },
      (err: unknown) => {
        this.log.error(`[collab] plan ${planId}: loading the document failed`, err);
        this.rooms.delete(planId);
        room.destroy();
        throw err;
      },
    );
    this.rooms.set(planId, room);
    return room;
  }

  private afterStore(room: PlanRoom, items: readonly StoredItem[]): void {
    for (const item of items) {
      if (!this.options.relayBeforeCommit) this.applyAccepted(room, item.update, item.socketId);
      room.markSeen(item.seq);
      this.events.stored(room.planId, item.update, item.seq);
      room.logCount++;
      room.logBytes += item.update.byteLength;
    }
    if (this.shouldCompact(room) && room.inFlight.size === 0) void this.compactNow(room);
  }

  private applyAccepted(room: PlanRoom, update: Uint8Array, socketId: string | undefined): void {
    try {
      Y.applyUpdate(room.doc, update, { kind: 'remote', socketId });
    } catch (err) {
      // Validated before, so this is a Yjs fault; the stored copy stays authoritative.
      this.log.error(`[collab] plan ${room.planId}: an accepted update did not apply`, err);
    }
  }

  private shouldCompact(room: PlanRoom): boolean {
    return (
      room.logCount >= this.options.compactAfterUpdates ||
      room.logBytes >= this.options.compactAfterBytes
    );
  }

  /** Waits for writes and compactions, compacts what is left, then unloads. */
  private close(room: PlanRoom): Promise<void> {
    if (room.closed) return room.closed;
    room.phase = 'closing';
    room.closed = (async () => {
      // A failed write keeps retrying inside `idle()`: the room stays until it is stored.
      await room.writer.idle();
      while (room.inFlight.size > 0) await Promise.all([...room.inFlight]);
      if (room.logCount > 0) await this.compactNow(room);
      this.rooms.delete(room.planId);
      room.destroy();
    })();
    return room.closed;
  }
}
