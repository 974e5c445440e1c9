import {
  E_SERIES_TOLERANCE,
  eSeriesMantissas,
  eSeriesValues,
  nearestESeries,
} from '@rampart/collab/engine/models/e-series';

// Reference lists: IEC 60063:2015, Table 1 (E6/E12/E24) and Table 2 (E48/E96), written here
// from memory of the standard, independently of the engine's table layout.
const IEC_E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6,
  6.2, 6.8, 7.5, 8.2, 9.1,
];
const IEC_E12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
const IEC_E6 = [1.0, 1.5, 2.2, 3.3, 4.7, 6.8];

describe('eSeriesMantissas', () => {
  it('E24 → the IEC 60063 E24 list', () => {
    expect(eSeriesMantissas('E24')).toEqual(IEC_E24);
  });

  it('E12 and E6 → the IEC 60063 lists', () => {
    expect(eSeriesMantissas('E12')).toEqual(IEC_E12);
    expect(eSeriesMantissas('E6')).toEqual(IEC_E6);
  });

  it('E96 → 96 values equal to 10^(i/96) rounded to 3 figures', () => {
    // IEC 60063: E48 and E96 values are 10^(i/n) rounded to three significant figures
    // (the exception 9.20 belongs to E192 only).
    const e96 = eSeriesMantissas('E96');
    expect(e96).toHaveLength(96);
    e96.forEach((v, i) => expect(v).toBeCloseTo(Number((10 ** (i / 96)).toPrecision(3)), 10));
  });

  it('E96 → contains the listed values 1.02, 4.99, 7.87 and 9.76', () => {
    // Values quoted in IEC 60063 Table 2 (common 1 % resistor values).
    for (const v of [1.02, 4.99, 7.87, 9.76]) expect(eSeriesMantissas('E96')).toContain(v);
  });

  it('E48 → 48 values, each 10^(i/48) rounded to 3 figures', () => {
    const e48 = eSeriesMantissas('E48');
    expect(e48).toHaveLength(48);
    e48.forEach((v, i) => expect(v).toBeCloseTo(Number((10 ** (i / 48)).toPrecision(3)), 10));
  });
});

describe('eSeriesValues', () => {
  it('E12 over 1 kΩ…10 kΩ → 1000, 1200 … 8200, 10000', () => {
    expect(eSeriesValues('E12', 1000, 10000)).toEqual([
      ...IEC_E12.map((m) => Math.round(m * 1000)),
      10000,
    ]);
  });

  it('E6 over 10 nF…100 nF → exact decimal values', () => {
    expect(eSeriesValues('E6', 1e-8, 1e-7)).toEqual([
      1e-8, 1.5e-8, 2.2e-8, 3.3e-8, 4.7e-8, 6.8e-8, 1e-7,
    ]);
  });

  it('empty range → RangeError naming the range', () => {
    expect(() => eSeriesValues('E24', 10, 1)).toThrow(/\[10, 1\]/);
  });

  it('nearestESeries(E24, 4.9k) → 5.1k (log distance)', () => {
    expect(nearestESeries('E24', 4900)).toBe(5100);
  });

  it('tolerances → E6 20 %, E12 10 %, E24 5 %, E48 2 %, E96 1 % (IEC 60063)', () => {
    expect(E_SERIES_TOLERANCE).toEqual({ E6: 20, E12: 10, E24: 5, E48: 2, E96: 1 });
  });
});
