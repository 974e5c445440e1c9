/**
 * Extreme-value analysis over tolerance corners, independent of what is evaluated: every 2^n
 * corner for n ≤ 12 varying parameters, otherwise the corners that one-at-a-time sensitivities
 * point to. Also an RSS estimate from the same one-at-a-time runs.
 */
import { LIMITS } from '../plan/plan-limits';

/**
 * Evaluates one corner: `positions[i]` ∈ {−1, 0, +1} for parameter i; returns one margin per
 * metric slot (null = not measurable, treated as the worst possible).
 */
export type CornerEvaluator = (positions: Float64Array) => ReadonlyArray<number | null>;

export interface SlotWorst {
  /** Worst margin found; null when some corner could not be measured (that corner is kept). */
  margin: number | null;
  positions: Float64Array;
  nominal: number | null;
  /** Nominal margin less the root-sum-square of the one-at-a-time margin losses. */
  rss: number | null;
  /** Per parameter: whether moving it alone changed this margin (for naming the culprits). */
  influential: boolean[];
}

export interface WorstCaseOutcome {
  method: 'exhaustive' | 'sensitivity';
  cornersEvaluated: number;
  slots: SlotWorst[];
}

/** Whether margin a is worse than b (null is worst of all). */
function worse(a: number | null, b: number | null): boolean {
  if (a === null) return b !== null;
  return b !== null && a < b;
}

function oneAtATime(n: number, evaluate: CornerEvaluator, nominal: ReadonlyArray<number | null>) {
  const plus: Array<ReadonlyArray<number | null>> = [];
  const minus: Array<ReadonlyArray<number | null>> = [];
  for (let i = 0; i < n; i++) {
    const p = new Float64Array(n);
    p[i] = 1;
    plus.push(evaluate(p));
    p[i] = -1;
    minus.push(evaluate(p));
  }
  const rss = nominal.map((m0, s) => {
    if (m0 === null) return null;
    let sum = 0;
    for (let i = 0; i < n; i++) {
      const a = plus[i][s];
      const b = minus[i][s];
      if (a === null || b === null) return null;
      const loss = Math.max(0, m0 - Math.min(a, b));
      sum += loss * loss;
    }
    return m0 - Math.sqrt(sum);
  });
  const influential = nominal.map((m0, s) =>
    Array.from({ length: n }, (_, i) => {
      const a = plus[i][s];
      const b = minus[i][s];
      if (m0 === null || a === null || b === null) return a !== b || a !== m0;
      // Below 0.01 % of the margin a change is solver noise, not a sensitivity.
      const noise = 1e-4 * Math.abs(m0) + 1e-15;
      return Math.abs(a - m0) > noise || Math.abs(b - m0) > noise;
    }),
  );
  return { plus, minus, rss, influential };
}

/**
 * Runs the worst-case analysis.
 * @param n number of varying parameters
 * @param slots number of metric slots the evaluator returns
 */
export function worstCase(n: number, slots: number, evaluate: CornerEvaluator): WorstCaseOutcome {
  const nominal = evaluate(new Float64Array(n));
  const oat = oneAtATime(n, evaluate, nominal);
  const best: SlotWorst[] = nominal.map((m, s) => ({
    margin: m,
    positions: new Float64Array(n),
    nominal: m,
    rss: oat.rss[s],
    influential: oat.influential[s],
  }));
  let evaluated = 1 + 2 * n;
  const consider = (positions: Float64Array, margins: ReadonlyArray<number | null>): void => {
    for (let s = 0; s < slots; s++) {
      if (worse(margins[s], best[s].margin))
        best[s] = { ...best[s], margin: margins[s], positions: positions.slice() };
    }
  };
  for (let i = 0; i < n; i++) {
    const p = new Float64Array(n);
    p[i] = 1;
    consider(p, oat.plus[i]);
    p[i] = -1;
    consider(p, oat.minus[i]);
  }
  if (n <= LIMITS.maxExhaustiveParameters) {
    const positions = new Float64Array(n);
    for (let mask = 0; mask < 1 << n; mask++) {
      for (let i = 0; i < n; i++) positions[i] = mask & (1 << i) ? 1 : -1;
      consider(positions, evaluate(positions));
      evaluated++;
    }
    return { method: 'exhaustive', cornersEvaluated: evaluated, slots: best };
  }
  // Beyond 12 parameters: per slot, move each parameter to the side that lowered its margin.
  const seen = new Set<string>();
  for (let s = 0; s < slots; s++) {
    const positions = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const a = oat.plus[i][s];
      const b = oat.minus[i][s];
      positions[i] = worse(a, b) ? 1 : worse(b, a) ? -1 : 1;
    }
    const key = positions.join(',');
    if (seen.has(key)) continue;
    seen.add(key);
    consider(positions, evaluate(positions));
    evaluated++;
  }
  return { method: 'sensitivity', cornersEvaluated: evaluated, slots: best };
}
