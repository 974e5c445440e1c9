/**
 * Dense LU factorisation with partial pivoting on a row-major Float64Array.
 *
 * Sizes are small (tens of unknowns), where a dense factorisation without indirection beats
 * sparse bookkeeping. The factorisation is kept so repeated solves with the same matrix (linear
 * network, unchanged step) cost only the two triangular sweeps. Those run far more often than
 * the factorisation, so the factors' nonzeros are listed once per factorisation and the sweeps
 * visit only them (MNA factors of a ladder or a board stay mostly zero).
 */

/** Relative pivot size below which the matrix is taken as singular. */
const PIVOT_EPS = 1e-20;

export class DenseLu {
  /** L (unit diagonal, below) and U (on and above) packed in one array. */
  private readonly lu: Float64Array;
  private readonly perm: Int32Array;
  private readonly work: Float64Array;
  /** Nonzeros of L below and of U above the diagonal, row by row (CSR), in column order. */
  private readonly lowerStart: Int32Array;
  private readonly upperStart: Int32Array;
  private readonly col: Int32Array;
  private readonly val: Float64Array;
  private readonly diag: Float64Array;

  constructor(readonly size: number) {
    this.lu = new Float64Array(size * size);
    this.perm = new Int32Array(size);
    this.work = new Float64Array(size);
    this.lowerStart = new Int32Array(size + 1);
    this.upperStart = new Int32Array(size + 1);
    this.col = new Int32Array(size * size);
    this.val = new Float64Array(size * size);
    this.diag = new Float64Array(size);
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
    this.listNonzeros();
    return -1;
  }

  /** Fills the CSR lists of L (first) and U (after it) and the diagonal of U. */
  private listNonzeros(): void {
    const n = this.size;
    const lu = this.lu;
    let k = 0;
    for (let i = 0; i < n; i++) {
      this.lowerStart[i] = k;
      for (let j = 0; j < i; j++) {
        const v = lu[i * n + j];
        if (v === 0) continue;
        this.col[k] = j;
        this.val[k++] = v;
      }
    }
    this.lowerStart[n] = k;
    for (let i = 0; i < n; i++) {
      this.upperStart[i] = k;
      this.diag[i] = lu[i * n + i];
      for (let j = i + 1; j < n; j++) {
        const v = lu[i * n + j];
        if (v === 0) continue;
        this.col[k] = j;
        this.val[k++] = v;
      }
    }
    this.upperStart[n] = k;
  }

  /** Solves A·x = b with the last factorisation; `x` may not alias `b`. */
  solve(b: Float64Array, x: Float64Array): void {
    const n = this.size;
    const { perm, lowerStart, upperStart, col, val, diag } = this;
    const y = this.work;
    // Same terms in the same order as the dense sweeps; skipped entries are exact zeros.
    for (let i = 0; i < n; i++) {
      let s = b[perm[i]];
      const end = lowerStart[i + 1];
      for (let k = lowerStart[i]; k < end; k++) s -= val[k] * y[col[k]];
      y[i] = s;
    }
    for (let i = n - 1; i >= 0; i--) {
      let s = y[i];
      const end = upperStart[i + 1];
      for (let k = upperStart[i]; k < end; k++) s -= val[k] * x[col[k]];
      x[i] = s / diag[i];
    }
  }
}
