import {
  DIELECTRIC_CLASSES,
  dielectricBand,
} from '@rampart/collab/engine/models/dielectric-classes';

// EIA-198 letter code, from memory: first letter X = −55 °C, Y = −30 °C; digit 5 = +85 °C,
// 6 = +105 °C, 7 = +125 °C; last letter R = ±15 %, S = ±22 %, V = +22/−82 %.
// Class I C0G (NP0): 0 ± 30 ppm/°C over −55…125 °C.
describe('DIELECTRIC_CLASSES', () => {
  it.each([
    ['X7R', -55, 125, 0.15, 0.15],
    ['X5R', -55, 85, 0.15, 0.15],
    ['X6S', -55, 105, 0.22, 0.22],
    ['Y5V', -30, 85, 0.82, 0.22],
  ] as const)('%s → range %d…%d °C, fall %d, rise %d', (cls, minC, maxC, fall, rise) => {
    expect(DIELECTRIC_CLASSES[cls]).toMatchObject({ minC, maxC, maxFall: fall, maxRise: rise });
  });

  it('C0G and NP0 → ±30 ppm/°C over −55…125 °C', () => {
    expect(DIELECTRIC_CLASSES.C0G).toMatchObject({ minC: -55, maxC: 125, ppmPerC: 30 });
    expect(DIELECTRIC_CLASSES.NP0).toEqual(DIELECTRIC_CLASSES.C0G);
  });
});

describe('dielectricBand', () => {
  it('X7R at 125 °C → [0.85, 1.15], the full published change at the range edge', () => {
    const [lo, hi] = dielectricBand('C3', 'X7R', 125);
    expect(lo).toBeCloseTo(0.85, 12);
    expect(hi).toBeCloseTo(1.15, 12);
  });

  it('Y5V at −30 °C → [0.18, 1.22]', () => {
    const [lo, hi] = dielectricBand('C9', 'Y5V', -30);
    expect(lo).toBeCloseTo(0.18, 12);
    expect(hi).toBeCloseTo(1.22, 12);
  });

  it('any class at 25 °C → exactly [1, 1]', () => {
    expect(dielectricBand('C1', 'X5R', 25)).toEqual([1, 1]);
  });

  it('C0G at 125 °C → ±0.3 % (30 ppm/°C × 100 °C)', () => {
    const [lo, hi] = dielectricBand('C2', 'C0G', 125);
    expect(lo).toBeCloseTo(0.997, 12);
    expect(hi).toBeCloseTo(1.003, 12);
  });

  it('X5R at 105 °C → PlanError naming the part and the range', () => {
    expect(() => dielectricBand('C4', 'X5R', 105)).toThrow(
      'part C4: 105 °C is outside the X5R range -55…85 °C',
    );
  });
});
