import { AwarenessThrottle } from '../../../server/collab/awareness-throttle';
import { TokenBucket } from '../../../server/collab/token-bucket';
import { eventually } from '../../utils/collab-client';

describe('TokenBucket', () => {
  it('burst 5 at 10/s → 5 taken at once, the 6th refused, one more after 100 ms', () => {
    const bucket = new TokenBucket(10, 5, 0);
    expect([1, 2, 3, 4, 5, 6].map(() => bucket.take(0))).toEqual([
      true,
      true,
      true,
      true,
      true,
      false,
    ]);
    expect(bucket.take(50)).toBe(false);
    expect(bucket.take(100)).toBe(true);
    expect(bucket.take(100)).toBe(false);
  });
});

describe('AwarenessThrottle', () => {
  it('30 presence updates in a burst at 10/s → first sent at once, the rest coalesced into the latest', async () => {
    const sent: number[] = [];
    const throttle = new AwarenessThrottle(10, (_plan, update) => sent.push(update[0]!));
    for (let i = 0; i < 30; i++) throttle.submit('plan-a', new Uint8Array([i]));
    expect(sent).toEqual([0]);
    await eventually(() => expect(sent).toEqual([0, 29]), 1000);
    throttle.cancel();
  });

  it('cancel(plan) → a waiting update for that plan is never sent', async () => {
    const sent: string[] = [];
    const throttle = new AwarenessThrottle(10, (plan) => sent.push(plan));
    throttle.submit('a', new Uint8Array([1]));
    throttle.submit('a', new Uint8Array([2]));
    throttle.cancel('a');
    await new Promise((r) => setTimeout(r, 150));
    expect(sent).toEqual(['a']);
  });
});
