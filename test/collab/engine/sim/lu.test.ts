/** Dense LU with partial pivoting against hand-checked systems. */
import { DenseLu } from '@rampart/collab/engine/sim/lu';
import { expectArrayClose } from '../../../utils/asserts';

describe('DenseLu', () => {
  it('factor+solve(3×3 needing a row swap) → the exact solution', () => {
    // [[0,2,1],[1,1,1],[2,1,0]]·[1,2,3] = [7,6,4] (checked by hand).
    const lu = new DenseLu(3);
    expect(lu.factor(Float64Array.from([0, 2, 1, 1, 1, 1, 2, 1, 0]))).toBe(-1);
    const x = new Float64Array(3);
    lu.solve(Float64Array.from([7, 6, 4]), x);
    expectArrayClose(x, [1, 2, 3], { abs: 1e-14 });
  });

  it('factor+solve(4×4 tridiagonal, zeros skipped by the sweeps) → the exact solution', () => {
    // [[2,-1,0,0],[-1,2,-1,0],[0,-1,2,-1],[0,0,-1,2]]·[1,2,3,4] = [0,0,0,5] (checked by hand).
    const lu = new DenseLu(4);
    const a = Float64Array.from([2, -1, 0, 0, -1, 2, -1, 0, 0, -1, 2, -1, 0, 0, -1, 2]);
    expect(lu.factor(a)).toBe(-1);
    const x = new Float64Array(4);
    lu.solve(Float64Array.from([0, 0, 0, 5]), x);
    expectArrayClose(x, [1, 2, 3, 4], { abs: 1e-14 });
  });

  it('factor+solve(permutation with a scaled entry) → the exact solution', () => {
    // [[0,1,0],[1,0,0],[0,0,3]]·[1,2,3] = [2,1,9]: only swaps, no fill-in (checked by hand).
    const lu = new DenseLu(3);
    expect(lu.factor(Float64Array.from([0, 1, 0, 1, 0, 0, 0, 0, 3]))).toBe(-1);
    const x = new Float64Array(3);
    lu.solve(Float64Array.from([2, 1, 9]), x);
    expect(Array.from(x)).toEqual([1, 2, 3]);
  });

  it('factor(singular 2×2) → index of the undetermined unknown', () => {
    expect(new DenseLu(2).factor(Float64Array.from([1, 2, 2, 4]))).toBe(1);
  });
});
