/**
 * A small plan shared by engine tests: an RC delay fed by the input ramp (0 → 5 V in 1 ms),
 * R1 10 k ±1 %, C1 100 nF ±10 % X7R, one delay requirement (≤ 2 ms from vin to rc at 2.5 V).
 * Plain JSON, as a plan file holds it; `parsePlan` it for the engine.
 */
export function rcDelayPlanJson(temperatures: number[] = [25, 125]): Record<string, unknown> {
  return {
    schemaVersion: 1,
    name: 'rc delay',
    nets: [{ id: 'vin' }, { id: 'rc' }],
    parts: [
      { id: 'VIN', kind: 'vsource', role: 'input', pos: 'vin', neg: '0', value: 5 },
      { id: 'R1', kind: 'resistor', a: 'vin', b: 'rc', value: 10e3, tolerance: { percent: 1 } },
      {
        id: 'C1',
        kind: 'capacitor',
        a: 'rc',
        b: '0',
        value: 100e-9,
        tolerance: { percent: 10 },
        temperature: { kind: 'dielectric', class: 'X7R' },
      },
    ],
    signals: [
      { id: 'vin', kind: 'rail', net: 'vin', nominal: 5, thresholds: { half: 2.5 } },
      { id: 'rc', kind: 'enable', net: 'rc', nominal: 5, thresholds: { half: 2.5 } },
    ],
    requirements: [
      {
        id: 'delay',
        kind: 'delay',
        from: { signal: 'vin', level: 'half' },
        to: { signal: 'rc', level: 'half' },
        max: 2e-3,
      },
    ],
    scenarios: [{ id: 'up', kind: 'power-up', temperatures }],
    settings: { duration: 10e-3, outputPoints: 1000 },
  };
}
