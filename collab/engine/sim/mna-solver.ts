/**
 * The assembled MNA system and its solver. The matrix of the last factorisation is kept, and a
 * new one is compared with it entry by entry: a linear network stepped with an unchanged step
 * size then reuses the LU factors and pays only the triangular solves.
 */
import { SingularMatrixError } from './errors';
import { DenseLu } from './lu';
import type { MnaSystem } from './stamp';

export class MnaSolver implements MnaSystem {
  readonly matrix: Float64Array;
  readonly rhs: Float64Array;
  private readonly factored: Float64Array;
  private readonly lu: DenseLu;
  private valid = false;
  /** Factorisations since the last `resetCount`. */
  factorisations = 0;

  constructor(
    readonly size: number,
    private readonly unknownNames: readonly string[],
  ) {
    this.matrix = new Float64Array(size * size);
    this.rhs = new Float64Array(size);
    this.factored = new Float64Array(size * size);
    this.lu = new DenseLu(size);
  }

  addConductance(a: number, b: number, g: number): void {
    const n = this.size;
    const m = this.matrix;
    if (a < n) {
      m[a * n + a] += g;
      if (b < n) {
        m[a * n + b] -= g;
        m[b * n + a] -= g;
      }
    }
    if (b < n) m[b * n + b] += g;
  }

  addCurrent(from: number, to: number, i: number): void {
    if (from < this.size) this.rhs[from] -= i;
    if (to < this.size) this.rhs[to] += i;
  }

  addEntry(row: number, col: number, v: number): void {
    if (row < this.size && col < this.size) this.matrix[row * this.size + col] += v;
  }

  clear(): void {
    this.matrix.fill(0);
    this.rhs.fill(0);
  }

  /** Zeroes the right-hand side only; the matrix keeps its last assembly. */
  clearRhs(): void {
    this.rhs.fill(0);
  }

  /**
   * Solves with the current factors, without assembling or comparing the matrix. Only valid
   * right after a `solve` whose matrix the caller knows is unchanged (linear network, same step
   * length and method).
   */
  solveFactored(x: Float64Array): void {
    this.lu.solve(this.rhs, x);
  }

  resetCount(): void {
    this.factorisations = 0;
    this.valid = false;
  }

  /** Solves the assembled system into x, factorising only if the matrix changed. */
  solve(x: Float64Array, t: number): void {
    if (!this.valid || !sameEntries(this.matrix, this.factored)) {
      const bad = this.lu.factor(this.matrix);
      this.factorisations++;
      if (bad >= 0) {
        this.valid = false;
        throw new SingularMatrixError(this.dependentUnknowns(bad), t);
      }
      this.factored.set(this.matrix);
      this.valid = true;
    }
    this.lu.solve(this.rhs, x);
  }

  /** Names of the unknowns in the column that lost its pivot and those sharing its rows. */
  private dependentUnknowns(col: number): string[] {
    const n = this.size;
    const names = new Set<string>([this.unknownNames[col]]);
    for (let r = 0; r < n; r++) {
      if (this.matrix[r * n + col] === 0) continue;
      for (let c = 0; c < n; c++) if (this.matrix[r * n + c] !== 0) names.add(this.unknownNames[c]);
    }
    return [...names].slice(0, 8);
  }
}

function sameEntries(a: Float64Array, b: Float64Array): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}
