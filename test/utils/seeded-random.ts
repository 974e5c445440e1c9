/**
 * A small seeded generator (mulberry32) for fuzz tests: the same seed gives the same run, so a
 * failure can be replayed. Not for anything that needs statistical quality.
 */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** An integer in [0, n). */
export function randomInt(random: () => number, n: number): number {
  return Math.floor(random() * n);
}
