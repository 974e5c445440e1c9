/** findCrossings on hand-made sampled waveforms (linear interpolation, exact by construction). */
import { findCrossings } from '@rampart/collab/engine/sim/crossings';
import { expectClose } from '../../../utils/asserts';

describe('findCrossings', () => {
  const tri = { time: [0, 1, 2, 3, 4], values: [0, 2, 0, 2, 0] };

  it('findCrossings(triangle, 1, either) → four interpolated crossings', () => {
    const c = findCrossings(tri, 1);
    expect(c.map((x) => x.direction)).toEqual(['rising', 'falling', 'rising', 'falling']);
    [0.5, 1.5, 2.5, 3.5].forEach((t, i) => expectClose(c[i].t, t, { abs: 1e-15 }, `crossing ${i}`));
  });

  it('findCrossings(triangle, 1, falling) → only falling crossings', () => {
    expect(findCrossings(tri, 1, 'falling').map((x) => x.t)).toEqual([1.5, 3.5]);
  });

  it('findCrossings(sample exactly on the level, passing through) → one crossing at that sample', () => {
    const c = findCrossings({ time: [0, 1, 2], values: [0, 1, 2] }, 1, 'rising');
    expect(c).toEqual([{ t: 1, direction: 'rising' }]);
  });

  it('findCrossings(touch and turn back) → no crossing', () => {
    expect(findCrossings({ time: [0, 1, 2], values: [0, 1, 0] }, 1)).toEqual([]);
  });

  it('findCrossings(jump at a repeated time) → crossing at that time', () => {
    const c = findCrossings({ time: [0, 1, 1, 2], values: [0, 0, 5, 5] }, 2.5);
    expect(c).toEqual([{ t: 1, direction: 'rising' }]);
  });

  it('findCrossings(NaN sample) → skipped, crossing from the neighbours', () => {
    const c = findCrossings({ time: [0, 1, 2], values: [0, Number.NaN, 2] }, 1);
    expect(c).toEqual([{ t: 1, direction: 'rising' }]);
  });
});
