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

  it('factor(singular 2×2) → index of the undetermined unknown', () => {
    expect(new DenseLu(2).factor(Float64Array.from([1, 2, 2, 4]))).toBe(1);
  });
});
