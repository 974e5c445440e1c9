/**
 * Reproducible random draws for Monte Carlo. Each run's stream depends only on (seed, run
 * index), so runs can be split across workers in any way and still draw the same values.
 * Streams come from d3-random's `randomLcg`, shaped by its `randomNormal`/`randomUniform`.
 */
import { randomLcg, randomNormal, randomUniform } from 'd3-random';
import type { Parameter } from '../models/parameters';

/** Murmur3's 32-bit finaliser: a fast bijective mix so neighbouring run indices diverge. */
function fmix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

/** Integer seed of run `index` for the analysis `seed`. */
export function runSeed(seed: number, index: number): number {
  // The +1 keeps the seed ≥ 1: randomLcg reads values in [0, 1) as fractions.
  return (fmix32((seed >>> 0) ^ fmix32(index + 0x9e3779b9)) % 0x7fffffff) + 1;
}

/** Positions of one run: x = tolerance position, y = temperature-band position (see parameters). */
export interface RunPositions {
  x: Float64Array;
  y: Float64Array;
}

/**
 * Draws tolerance and temperature-band positions of every parameter for run `index`. Normal
 * parameters draw x = z/k (tolerance = k·σ, not truncated); uniform ones draw x ∈ [−1, 1).
 * The temperature-band position is uniform in [−1, 1): the standards bound the change, they
 * give no distribution. Both are always drawn so the stream layout never depends on the values.
 */
export function drawRun(params: readonly Parameter[], seed: number, index: number): RunPositions {
  const source = randomLcg(runSeed(seed, index));
  const uniform = randomUniform.source(source)(-1, 1);
  const normal = randomNormal.source(source)(0, 1);
  const x = new Float64Array(params.length);
  const y = new Float64Array(params.length);
  for (let i = 0; i < params.length; i++) {
    const d = params[i].distribution;
    x[i] = d.kind === 'normal' ? normal() / d.k : uniform();
    y[i] = uniform();
  }
  return { x, y };
}
