import * as encoding from 'lib0/encoding';
import * as Y from 'yjs';

/**
 * What a peer with `stateVector` lacks from `doc`, as one or more updates each at most about
 * `maxBytes` long, so a large plan's initial sync never exceeds a packet limit. Each chunk is a
 * valid update on its own: it carries the structs of a group of Yjs clients (and the delete
 * set). A single client's content larger than `maxBytes` stays one chunk; Yjs offers no cheaper
 * valid split of it.
 */
export function encodeStateInChunks(
  doc: Y.Doc,
  stateVector: Uint8Array | undefined,
  maxBytes: number,
): Uint8Array[] {
  const full = Y.encodeStateAsUpdate(doc, stateVector);
  if (full.byteLength <= maxBytes) return [full];
  const remote = stateVector ? Y.decodeStateVector(stateVector) : new Map<number, number>();
  const local = Y.encodeStateVector(doc);
  const localMap = Y.decodeStateVector(local);
  const lacking = [...localMap.keys()].filter((c) => (remote.get(c) ?? 0) < localMap.get(c)!);
  // Per client: the diff that holds only this client's missing structs.
  const parts = lacking.map((client) => {
    const pretend = new Map(localMap);
    pretend.set(client, remote.get(client) ?? 0);
    return Y.encodeStateAsUpdate(doc, encodeVector(pretend));
  });
  const chunks: Uint8Array[] = [];
  let group: Uint8Array[] = [];
  let size = 0;
  for (const part of parts) {
    if (group.length > 0 && size + part.byteLength > maxBytes) {
      chunks.push(Y.mergeUpdates(group));
      group = [];
      size = 0;
    }
    group.push(part);
    size += part.byteLength;
  }
  if (group.length > 0) chunks.push(Y.mergeUpdates(group));
  return chunks;
}

/** A state vector in Yjs's v1 encoding: count, then (client, clock) pairs. */
function encodeVector(map: Map<number, number>): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, map.size);
  for (const [client, clock] of map) {
    encoding.writeVarUint(e, client);
    encoding.writeVarUint(e, clock);
  }
  return encoding.toUint8Array(e);
}
