import type { Server as SocketServer } from 'socket.io';
import { Awareness, applyAwarenessUpdate } from 'y-protocols/awareness';
import * as Y from 'yjs';

import { PLAN_NAMESPACE } from '@rampart/collab/sync/events';
import { MessageType, SyncStep } from '@rampart/collab/sync/message-type';
import {
  decodePlanMessage,
  toWire,
  encodeAwarenessBytes,
  encodeStep2Update,
  encodeSyncStep1,
  encodeUpdate,
} from '@rampart/collab/sync/wire-codec';

/**
 * The comparison relay of the benchmark: the same namespace, events and messages as the real
 * one, with no authentication, no roles, no rate limits and no persistence (updates are
 * acknowledged as soon as they are applied in memory). What the real relay costs on top of
 * this is the price of its guarantees.
 */
export function attachBareRelay(io: SocketServer): () => void {
  const rooms = new Map<string, { doc: Y.Doc; awareness: Awareness }>();
  const room = (planId: string) => {
    let r = rooms.get(planId);
    if (!r) {
      const doc = new Y.Doc();
      r = { doc, awareness: new Awareness(doc) };
      rooms.set(planId, r);
    }
    return r;
  };
  const ns = io.of(PLAN_NAMESPACE);
  ns.on('connection', (socket) => {
    socket.on('plan:join', (planId: string, ack: (r: unknown) => void) => {
      const r = room(planId);
      void socket.join(planId);
      ack({ data: { planId, role: 'editor', readOnly: false } });
      socket.emit('plan:synced', planId, toWire(encodeSyncStep1(r.doc)));
    });
    socket.on('plan:sync', (planId: string, payload: unknown, ack?: (r: unknown) => void) => {
      const r = rooms.get(planId);
      const decoded = decodePlanMessage(payload);
      if (!r || !decoded.ok) return ack?.({ error: { code: 'malformed', message: 'bad' } });
      const m = decoded.message;
      if (m.type === MessageType.Awareness) {
        applyAwarenessUpdate(r.awareness, m.update, socket.id);
        socket.to(planId).emit('plan:synced', planId, toWire(encodeAwarenessBytes(m.update)));
        return ack?.({ data: { stored: [] } });
      }
      if (m.step === SyncStep.Step1) {
        socket.emit(
          'plan:synced',
          planId,
          toWire(encodeStep2Update(Y.encodeStateAsUpdate(r.doc, m.stateVector))),
        );
        socket.emit('plan:loaded', planId);
        return ack?.({ data: { stored: [] } });
      }
      Y.applyUpdate(r.doc, m.update);
      socket.to(planId).emit('plan:synced', planId, toWire(encodeUpdate(m.update)));
      return ack?.({ data: { stored: [0] } });
    });
  });
  return () => {
    for (const r of rooms.values()) r.doc.destroy();
    rooms.clear();
  };
}
