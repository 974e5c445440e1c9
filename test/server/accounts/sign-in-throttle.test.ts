import { SignInThrottle } from '../../../server/domain/sign-in-throttle';

describe('SignInThrottle', () => {
  const make = () => {
    let now = 1_000_000;
    const throttle = new SignInThrottle({
      freeFailures: 3,
      baseDelayMs: 1000,
      maxDelayMs: 8000,
      now: () => now,
    });
    return { throttle, advance: (ms: number) => (now += ms) };
  };

  test('delayAfter(n) → 0 for free failures, then 1 s, 2 s, 4 s, 8 s, capped at 8 s', () => {
    const { throttle } = make();
    expect([0, 1, 2, 3, 4, 5, 6, 7, 8, 40].map((n) => throttle.delayAfter(n))).toEqual([
      0, 0, 0, 0, 1000, 2000, 4000, 8000, 8000, 8000,
    ]);
  });

  test('waitMs after 5 failures → 2000, shrinking with time, 0 after the wait', () => {
    const { throttle, advance } = make();
    for (let i = 0; i < 5; i++) throttle.recordFailure('a@example.test');
    expect(throttle.waitMs('a@example.test')).toBe(2000);
    advance(1500);
    expect(throttle.waitMs('a@example.test')).toBe(500);
    advance(500);
    expect(throttle.waitMs('a@example.test')).toBe(0);
    expect(throttle.waitMs('b@example.test')).toBe(0);
  });

  test('recordSuccess → the account starts over', () => {
    const { throttle } = make();
    for (let i = 0; i < 6; i++) throttle.recordFailure('a@example.test');
    throttle.recordSuccess('a@example.test');
    expect(throttle.waitMs('a@example.test')).toBe(0);
    throttle.recordFailure('a@example.test');
    expect(throttle.waitMs('a@example.test')).toBe(0);
  });
});
