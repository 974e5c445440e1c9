/**
 * Dense LU factorisation with partial pivoting on a row-major Float64Array.
 *
 * Sizes are small (tens of unknowns), where a dense kernel without indirection beats sparse
 * bookkeeping. The factorisation is kept so repeated solves with the same matrix (linear network,
 * unchanged step) cost only the two triangular sweeps.
 */

/** Relative pivot size below which the matrix is taken as singular. */
const PIVOT_EPS = 1e-20;

export class DenseLu {
  /** L (unit diagonal, below) and U (on and above) packed in one array. */
  private readonly lu: Float64Array;
  private readonly perm: Int32Array;
  private readonly work: Float64Array;

  constructor(readonly size: number) {
    this.lu = new Float64Array(size * size);
    this.perm = new Int32Array(size);
    this.work = new Float64Array(size);
  }

  /**
   * Factorises `a` (left untouched). Returns -1 on success, otherwise the column index at which
   * no usable pivot was found (the unknown that is not determined).
   */
  factor(a: Float64Array): number {
    const n = this.size;
    const lu = this.lu;
    lu.set(a);
    let scale = 0;
    for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(lu[i]));
    const tiny = scale * PIVOT_EPS;
    for (let i = 0; i < n; i++) this.perm[i] = i;
    for (let k = 0; k < n; k++) {
      let p = k;
      let best = Math.abs(lu[k * n + k]);
      for (let i = k + 1; i < n; i++) {
        const v = Math.abs(lu[i * n + k]);
        if (v > best) {
          best = v;
          p = i;
        }
      }
      if (!(best > tiny)) return k;
      if (p !== k) {
        for (let j = 0; j < n; j++) {
          const t = lu[k * n + j];
          lu[k * n + j] = lu[p * n + j];
          lu[p * n + j] = t;
        }
        const t = this.perm[k];
        this.perm[k] = this.perm[p];
        this.perm[p] = t;
      }
      const inv = 1 / lu[k * n + k];
      for (let i = k + 1; i < n; i++) {
        const f = lu[i * n + k] * inv;
        if (f === 0) continue;
        lu[i * n + k] = f;
        const ri = i * n;
        const rk = k * n;
        for (let j = k + 1; j < n; j++) lu[ri + j] -= f * lu[rk + j];
      }
    }
    return -1;
  }

  /** Solves A·x = b with the last factorisation; `x` may not alias `b`. */
  solve(b: Float64Array, x: Float64Array): void {
    const n = this.size;
    const lu = this.lu;
    const y = this.work;
    for (let i = 0; i < n; i++) {
      let s = b[this.perm[i]];
      const ri = i * n;
      for (let j = 0; j < i; j++) s -= lu[ri + j] * y[j];
      y[i] = s;
    }
    for (let i = n - 1; i >= 0; i--) {
      let s = y[i];
      const ri = i * n;
      for (let j = i + 1; j < n; j++) s -= lu[ri + j] * x[j];
      x[i] = s / lu[ri + i];
    }
  }
}
