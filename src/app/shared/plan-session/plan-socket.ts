import { Injectable } from '@angular/core';
import { io, type Socket } from 'socket.io-client';

import {
  PLAN_NAMESPACE,
  type ClientToServerEvents,
  type ServerToClientEvents,
} from '@rampart/collab/sync/events';

/** The typed socket.io client of the live-plan namespace. */
export type PlanClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

/**
 * Opens sockets to the relay. A seam of its own so specs can hand the session a fake socket and
 * never open a connection.
 */
@Injectable({ providedIn: 'root' })
export class PlanSocketFactory {
  /** A new socket to this page's own origin; the session cookie authenticates the handshake. */
  open(): PlanClientSocket {
    return io(PLAN_NAMESPACE, {
      withCredentials: true,
      // Reconnect for ever, backing off to 10 s: an engineer on a train should get back in.
      reconnectionDelayMax: 10_000,
      autoConnect: true,
    });
  }
}
