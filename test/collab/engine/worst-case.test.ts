import { worstCase } from '@rampart/collab/engine/analysis/worst-case';
import { rcDelayToThreshold } from '@rampart/collab/engine/analysis/closed-form';

describe('worstCase', () => {
  // RC delay to a threshold, t = −R·C·ln(1 − Vth/V) (circuit theory): the longest delay is at
  // R+ and C+, so a "delay ≤ max" margin is smallest there; the Vth axis also lengthens it at Vth+.
  const R = 100e3;
  const C = 100e-9;
  const tolR = 0.01;
  const tolC = 0.1;
  const tolV = 0.05;
  const delay = (p: Float64Array): number =>
    rcDelayToThreshold(R * (1 + tolR * p[0]) * C * (1 + tolC * p[1]), 1.2 * (1 + tolV * p[2]), 5) ??
    Number.NaN;
  const max = 4e-3;

  it('RC delay ≤ 4 ms over R ±1 %, C ±10 %, Vth ±5 % → worst corner R+, C+, Vth+ with the analytic margin', () => {
    const out = worstCase(3, 1, (p) => [max - delay(p)]);
    expect(out.method).toBe('exhaustive');
    expect(Array.from(out.slots[0].positions)).toEqual([1, 1, 1]);
    const analytic = max - -(R * 1.01 * C * 1.1) * Math.log(1 - (1.2 * 1.05) / 5);
    expect(out.slots[0].margin).toBeCloseTo(analytic, 15);
    expect(out.cornersEvaluated).toBe(1 + 2 * 3 + 8);
  });

  it('delay ≥ 2 ms → worst corner R−, C−, Vth−', () => {
    const out = worstCase(3, 1, (p) => [delay(p) - 2e-3]);
    expect(Array.from(out.slots[0].positions)).toEqual([-1, -1, -1]);
  });

  it('linear margin Σ aᵢxᵢ + 10 with 14 parameters → sensitivity path finds −Σ|aᵢ| + 10 and RSS = 10 − √Σaᵢ²', () => {
    const a = Array.from({ length: 14 }, (_, i) => (i % 2 === 0 ? 1 : -1) * (i + 1) * 0.1);
    const f = (p: Float64Array): number => 10 + a.reduce((s, ai, i) => s + ai * p[i], 0);
    const out = worstCase(14, 1, (p) => [f(p)]);
    expect(out.method).toBe('sensitivity');
    expect(out.slots[0].margin).toBeCloseTo(10 - a.reduce((s, ai) => s + Math.abs(ai), 0), 12);
    expect(Array.from(out.slots[0].positions)).toEqual(a.map((ai) => (ai > 0 ? -1 : 1)));
    expect(out.slots[0].rss).toBeCloseTo(10 - Math.sqrt(a.reduce((s, ai) => s + ai * ai, 0)), 12);
  });

  it('a corner where the margin cannot be measured → that corner is reported as worst (null margin)', () => {
    const out = worstCase(2, 1, (p) => [p[0] > 0 && p[1] > 0 ? null : 1]);
    expect(out.slots[0].margin).toBeNull();
    expect(Array.from(out.slots[0].positions)).toEqual([1, 1]);
  });
});
