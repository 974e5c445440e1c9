import { randomLcg } from 'd3-random';

/**
 * A seeded uniform source in [0, 1) for fuzz tests (d3-random's linear congruential generator):
 * the same seed gives the same run, so a failure can be replayed.
 */
export function seededRandom(seed: number): () => number {
  return randomLcg(seed);
}

/** An integer in [0, n). */
export function randomInt(random: () => number, n: number): number {
  return Math.floor(random() * n);
}
