import * as Y from 'yjs';

/**
 * Whether applying `update` to `doc` would change nothing: every struct is already within the
 * doc's state vector and every deletion already deleted. A peer's step 2 always repeats the
 * whole delete set, so "no structs" alone does not mean "nothing new"; this check lets the relay
 * skip storing repeats and lets a read-only peer's harmless step 2 pass without a denial.
 */
export function addsNothing(doc: Y.Doc, update: Uint8Array): boolean {
  const decoded = Y.decodeUpdate(update);
  const sv = Y.decodeStateVector(Y.encodeStateVector(doc));
  for (const s of decoded.structs) {
    if ((sv.get(s.id.client) ?? 0) < s.id.clock + s.length) return false;
  }
  if (decoded.ds.clients.size === 0) return true;
  // Snapshot deletions are sorted and merged per client (Yjs builds them from the struct store).
  const known = Y.snapshot(doc).ds.clients;
  for (const [client, ranges] of decoded.ds.clients) {
    const have = known.get(client) ?? [];
    for (const r of ranges) {
      if (!have.some((h) => h.clock <= r.clock && r.clock + r.len <= h.clock + h.len)) return false;
    }
  }
  return true;
}
