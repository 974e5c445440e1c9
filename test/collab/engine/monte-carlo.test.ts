import {
  mergeChunks,
  runMonteCarloChunk,
  slotSamples,
} from '@rampart/collab/engine/analysis/monte-carlo';
import { summarize } from '@rampart/collab/engine/analysis/statistics';
import { parameterValue, type Parameter } from '@rampart/collab/engine/models/parameters';

function resistor(
  id: string,
  nominal: number,
  pct: number,
  distribution: Parameter['distribution'],
): Parameter {
  return {
    id,
    partId: id,
    field: 'value',
    nominal,
    low: nominal * (1 - pct / 100),
    high: nominal * (1 + pct / 100),
    distribution,
    temperature: { kind: 'none' },
  };
}

const normal3 = { kind: 'normal', k: 3 } as const;
const uniform = { kind: 'uniform' } as const;

describe('runMonteCarloChunk', () => {
  it('divider R2/(R1+R2), 10 k ±1 % normal (k = 3), 20 000 runs → mean 0.5 and σ = √2·σR/(4R) within statistical bounds', () => {
    // First-order propagation: ∂ρ/∂R1 = −1/(4R), ∂ρ/∂R2 = 1/(4R) at R1 = R2 = R.
    const params = [resistor('R1', 1e4, 1, normal3), resistor('R2', 1e4, 1, normal3)];
    const runs = 20000;
    const chunk = runMonteCarloChunk({
      parameters: params,
      seed: 42,
      runs,
      slots: 1,
      evaluate: ({ x, y }) => {
        const r1 = parameterValue(params[0], x[0], y[0], 25);
        const r2 = parameterValue(params[1], x[1], y[1], 25);
        return [r2 / (r1 + r2)];
      },
    });
    const s = summarize(slotSamples(chunk, 0));
    const sigma = (Math.SQRT2 * (0.01 / 3)) / 4;
    expect(s?.count).toBe(runs);
    // 4 standard errors of the mean; σ's standard error is σ/√(2N) ≈ 0.5 %, allow 3 %.
    expect(Math.abs((s?.mean ?? 0) - 0.5)).toBeLessThan((4 * sigma) / Math.sqrt(runs));
    expect(Math.abs((s?.sigma ?? 0) / sigma - 1)).toBeLessThan(0.03);
  });

  it('sum of 4 uniform positions on [−1, 1) → mean 0, σ = √(4/3) within statistical bounds', () => {
    const params = ['A', 'B', 'C', 'D'].map((id) => resistor(id, 1, 10, uniform));
    const chunk = runMonteCarloChunk({
      parameters: params,
      seed: 7,
      runs: 20000,
      slots: 1,
      evaluate: ({ x }) => [x[0] + x[1] + x[2] + x[3]],
    });
    const s = summarize(slotSamples(chunk, 0));
    const sigma = Math.sqrt(4 / 3);
    expect(Math.abs(s?.mean ?? 1)).toBeLessThan((4 * sigma) / Math.sqrt(20000));
    expect(Math.abs((s?.sigma ?? 0) / sigma - 1)).toBeLessThan(0.03);
    expect(s?.min).toBeGreaterThanOrEqual(-4);
    expect(s?.max).toBeLessThan(4);
  });

  const params = [resistor('R1', 1e3, 5, normal3), resistor('C1', 1e-6, 10, uniform)];
  const evaluate = ({ x, y }: { x: Float64Array; y: Float64Array }) => [
    x[0] * 2 + x[1],
    y[0] - y[1],
  ];

  it('three chunks merged → bit-identical samples and summary to one run, same seed', () => {
    const whole = runMonteCarloChunk({
      parameters: params,
      seed: 123,
      runs: 10000,
      slots: 2,
      evaluate,
    });
    const parts = [
      runMonteCarloChunk({
        parameters: params,
        seed: 123,
        runs: 10000,
        start: 7000,
        end: 10000,
        slots: 2,
        evaluate,
      }),
      runMonteCarloChunk({
        parameters: params,
        seed: 123,
        runs: 10000,
        start: 0,
        end: 3000,
        slots: 2,
        evaluate,
      }),
      runMonteCarloChunk({
        parameters: params,
        seed: 123,
        runs: 10000,
        start: 3000,
        end: 7000,
        slots: 2,
        evaluate,
      }),
    ];
    const merged = mergeChunks(parts);
    expect(Array.from(merged.samples)).toEqual(Array.from(whole.samples));
    expect(summarize(slotSamples(merged, 0))).toEqual(summarize(slotSamples(whole, 0)));
  });

  it('same seed twice → same samples; another seed → different samples', () => {
    const a = runMonteCarloChunk({ parameters: params, seed: 5, runs: 100, slots: 2, evaluate });
    const b = runMonteCarloChunk({ parameters: params, seed: 5, runs: 100, slots: 2, evaluate });
    const c = runMonteCarloChunk({ parameters: params, seed: 6, runs: 100, slots: 2, evaluate });
    expect(Array.from(a.samples)).toEqual(Array.from(b.samples));
    expect(Array.from(a.samples)).not.toEqual(Array.from(c.samples));
  });

  it('shouldCancel true after 50 runs → chunk ends at run 50, marked cancelled, progress reports 50', () => {
    let done = 0;
    const progress: number[] = [];
    const chunk = runMonteCarloChunk({
      parameters: params,
      seed: 1,
      runs: 1000,
      slots: 2,
      progressEvery: 25,
      evaluate: (p) => {
        done++;
        return evaluate(p);
      },
      shouldCancel: () => done >= 50,
      onProgress: (n) => progress.push(n),
    });
    expect(chunk.end).toBe(50);
    expect(chunk.cancelled).toBe(true);
    expect(progress).toEqual([25, 50, 50]);
  });

  it('100 001 runs → error stating the 100 000 limit', () => {
    expect(() =>
      runMonteCarloChunk({ parameters: params, seed: 1, runs: 100001, slots: 1, evaluate }),
    ).toThrow(/1 to 100000, got 100001/);
  });

  it('overlapping chunks → merge error naming the run', () => {
    const a = runMonteCarloChunk({
      parameters: params,
      seed: 1,
      runs: 100,
      start: 0,
      end: 60,
      slots: 2,
      evaluate,
    });
    const b = runMonteCarloChunk({
      parameters: params,
      seed: 1,
      runs: 100,
      start: 50,
      end: 100,
      slots: 2,
      evaluate,
    });
    expect(() => mergeChunks([a, b])).toThrow(/at run 60/);
  });
});

describe('summarize', () => {
  it('1…101 → exact percentiles p50 = 51, p5 = 6, p95 = 96, histogram counts sum to 101', () => {
    const s = summarize(
      Float64Array.from({ length: 101 }, (_, i) => i + 1),
      10,
    );
    expect(s?.percentiles.p50).toBe(51);
    expect(s?.percentiles.p5).toBe(6);
    expect(s?.percentiles.p95).toBe(96);
    expect(s?.histogram.counts.reduce((a, b) => a + b, 0)).toBe(101);
    expect(s?.sigma).toBeCloseTo(Math.sqrt((101 * 102) / 12), 9);
  });

  it('only NaN samples → null, never NaN statistics', () => {
    expect(summarize(Float64Array.of(Number.NaN, Number.NaN))).toBeNull();
  });
});
