import { analyzePlan } from '@rampart/collab/engine/analysis/analyze-plan';
import { createEngineSimulator } from '@rampart/collab/engine/analysis/engine-simulator';
import { rcRampResponse } from '@rampart/collab/engine/analysis/closed-form';
import {
  planMonteCarloChunk,
  summarizePlanMonteCarlo,
} from '@rampart/collab/engine/analysis/plan-monte-carlo';
import { preparePlan } from '@rampart/collab/engine/analysis/plan-runner';
import { parsePlan } from '@rampart/collab/engine/plan/validate-plan';
import { suggestValues } from '@rampart/collab/engine/analysis/value-suggestion';
import { ConvergenceError } from '@rampart/collab/engine/sim/simulate';
import { rcDelayPlanJson } from './rc-delay-plan';

// An RC delay fed by the input ramp (0 → 5 V in 1 ms): R1 10 k ±1 %, C1 100 nF ±10 % X7R.
const rcPlan = parsePlan(rcDelayPlanJson());

/** Closed-form delay from vin = 2.5 V (t = 0.5 ms) to rc = 2.5 V for a given τ (bisection). */
function rampDelay(tau: number): number {
  let lo = 0;
  let hi = 0.1;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (rcRampResponse(mid, tau, 5, 1e-3) < 2.5) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2 - 0.5e-3;
}

describe('analyzePlan', () => {
  const simulate = createEngineSimulator();

  it('RC plan at nominal → delay equals the closed-form ramp response within 0.1 %, closed-form check beside it', () => {
    const r = analyzePlan(rcPlan, { simulate });
    const m = r.cases[0].requirements[0];
    expect(m.measured).not.toBeNull();
    expect(Math.abs((m.measured ?? 0) / rampDelay(1e-3) - 1)).toBeLessThan(1e-3);
    const check = r.closedForm.find((c) => c.scenarioId === 'up' && c.temperature === 25);
    expect(check?.description).toMatch(/R1·C1 from VIN to 2.5 V/);
    expect(Math.abs(check?.relativeDifference ?? 1)).toBeLessThan(1e-3);
  });

  it('RC plan with corners → worst delay at R1 +1 %, C1 +26.5 % (10 % and X7R +15 %), 125 °C, matching the closed form', () => {
    // Longest RC delay is at R+ and C+ (circuit theory); X7R at its 125 °C edge adds +15 %.
    const r = analyzePlan(rcPlan, { simulate, corners: true });
    const w = r.worstCase?.[0];
    expect(w?.method).toBe('exhaustive');
    expect(w?.temperature).toBe(125);
    expect(w?.cornerLabel).toBe('up: R1 +1 %, C1 +26.5 %, 125 °C');
    expect(w?.corner.C1).toBeCloseTo(100e-9 * 1.1 * 1.15, 18);
    const expected = rampDelay(10e3 * 1.01 * 100e-9 * 1.1 * 1.15);
    expect(Math.abs((w?.worst?.measured ?? 0) / expected - 1)).toBeLessThan(1e-3);
    expect(w?.worst?.margin).toBeCloseTo(2e-3 - (w?.worst?.measured ?? 0), 12);
    expect(Number.isFinite(w?.rssMargin ?? Number.NaN)).toBe(true);
    const curve = r.cases[1].curves.find((c) => c.signal === 'rc');
    expect(curve?.cornerMin?.length).toBe(1000);
    expect((curve?.cornerMax?.[300] ?? 0) >= (curve?.cornerMin?.[300] ?? 1)).toBe(true);
  });

  it('plan Monte Carlo split into 3 chunks → identical summary to one chunk, same seed', () => {
    const prep = preparePlan(rcPlan);
    const whole = summarizePlanMonteCarlo(prep, [
      planMonteCarloChunk(prep, simulate, { runs: 60, seed: 9 }),
    ]);
    const split = summarizePlanMonteCarlo(prep, [
      planMonteCarloChunk(prep, simulate, { runs: 60, seed: 9, start: 40, end: 60 }),
      planMonteCarloChunk(prep, simulate, { runs: 60, seed: 9, start: 0, end: 25 }),
      planMonteCarloChunk(prep, simulate, { runs: 60, seed: 9, start: 25, end: 40 }),
    ]);
    expect(split).toEqual(whole);
    expect(whole.requirements[0].yieldPass).toBe(1);
    expect(whole.requirements[0].margin?.count).toBe(60);
  });

  it('unknown scenario → error naming it and the known ones', () => {
    expect(() => analyzePlan(rcPlan, { simulate, scenario: 'nope' })).toThrow(
      'scenario nope: not in the plan (known: up)',
    );
  });
});

describe('analyzePlan with Monte Carlo bands', () => {
  it('20 runs → p05 ≤ p95 with a visible spread on the rc curve, one value per output time', () => {
    const r = analyzePlan(rcPlan, {
      simulate: createEngineSimulator(),
      monteCarlo: { runs: 20, seed: 4, bandRuns: 20 },
    });
    const curve = r.cases[0].curves.find((c) => c.signal === 'rc');
    expect(curve?.p05).toHaveLength(r.cases[0].time.length);
    const k = 200; // 2 ms: the RC is mid-rise, the spread is visible
    expect((curve?.p95?.[k] ?? 0) - (curve?.p05?.[k] ?? 0)).toBeGreaterThan(1e-3);
    expect(curve?.p05?.[k]).toBeLessThanOrEqual(curve?.p95?.[k] ?? 0);
  });
});

describe('suggestValues', () => {
  it('C1 over E6 in 10 nF…1 µF → exactly the values whose worst-case delay (R+1 %, C+26.5 %) keeps a 30 % margin to 2 ms', () => {
    const s = suggestValues(rcPlan, 'C1', 'E6', createEngineSimulator(), { low: 1e-8, high: 1e-6 });
    expect(s.candidates.map((c) => c.value)).toEqual([
      1e-8, 1.5e-8, 2.2e-8, 3.3e-8, 4.7e-8, 6.8e-8, 1e-7, 1.5e-7, 2.2e-7, 3.3e-7, 4.7e-7, 6.8e-7,
      1e-6,
    ]);
    // Closed form: worst delay from the ramp response at τ = 10 k·1.01 · C·1.1·1.15.
    const expected = s.candidates
      .map((c) => c.value)
      .filter((c) => (2e-3 - rampDelay(10e3 * 1.01 * c * 1.1 * 1.15)) / 2e-3 >= 0.3);
    expect(s.suitable).toEqual(expected);
    expect(s.suitable.length).toBeGreaterThan(3);
    expect(s.suitable.length).toBeLessThan(13);
  });

  it('unknown part → PlanError naming it', () => {
    expect(() => suggestValues(rcPlan, 'C9', 'E12', createEngineSimulator())).toThrow(
      'part C9: not in the plan',
    );
  });
});

describe('analyzePlan closed-form checks', () => {
  it('capacitive + resistive divider behind a 10 V step → closed form one τ after the step beside the simulation, within 0.1 %', () => {
    const plan = parsePlan({
      schemaVersion: 1,
      name: 'divider',
      nets: [{ id: 'in' }, { id: 'mid' }],
      parts: [
        {
          id: 'V1',
          kind: 'vsource',
          pos: 'in',
          neg: '0',
          value: 10,
          wave: { kind: 'step', t0: 1e-4 },
        },
        { id: 'R1', kind: 'resistor', a: 'in', b: 'mid', value: 100e3 },
        { id: 'C1', kind: 'capacitor', a: 'in', b: 'mid', value: 1e-9 },
        { id: 'R2', kind: 'resistor', a: 'mid', b: '0', value: 100e3 },
        { id: 'C2', kind: 'capacitor', a: 'mid', b: '0', value: 3e-9 },
      ],
      signals: [{ id: 'mid', kind: 'reference', net: 'mid', nominal: 5 }],
      requirements: [],
      scenarios: [{ id: 'up', kind: 'power-up', temperatures: [25] }],
      settings: { duration: 2e-3 },
    });
    const r = analyzePlan(plan, { simulate: createEngineSimulator() });
    const check = r.closedForm.find((c) => c.id === 'R1-C1-R2-C2');
    // Circuit theory: 5 + (2.5 − 5)·e^−1 one τ = 200 µs after the step.
    expect(check?.closedForm).toBeCloseTo(5 - 2.5 * Math.exp(-1), 12);
    expect(check?.unit).toBe('V');
    expect(Math.abs(check?.relativeDifference ?? 1)).toBeLessThan(1e-3);
  });
});

describe('analyzePlan errors', () => {
  it('simulator non-convergence → SimulationFailedError naming scenario, temperature, time and parts', () => {
    const failing = (): never => {
      throw new ConvergenceError(1e-3, ['D1']);
    };
    expect(() => analyzePlan(rcPlan, { simulate: failing })).toThrow(
      'scenario up at 25 °C (25 °C): Newton iteration did not converge at t = 0.001 s (parts not settled: D1)',
    );
  });

  it('200 000 output points → error stating the 100 000 limit', () => {
    const big = { ...rcPlan, settings: { ...rcPlan.settings, outputPoints: 200000 } };
    expect(() => analyzePlan(big, { simulate: createEngineSimulator() })).toThrow(
      'settings.outputPoints is 200000; the limit is 100000',
    );
  });
});
