import { formatEngineering, parseEngineering } from '@rampart/collab/doc/engineering-notation';

// Sources: SI prefixes from the BIPM SI Brochure (9th ed., table 7); the letter-as-decimal-point
// codes (4k7, 2n2, 0R1) from IEC 60062's RKM code.
describe('parseEngineering', () => {
  test.each([
    ['4k7', 4700],
    ['4.7k', 4700],
    ['2.2u', 2.2e-6],
    ['2.2µF', 2.2e-6],
    ['2n2', 2.2e-9],
    ['0R1', 0.1],
    ['10 ms', 0.01],
    ['100 kΩ', 100_000],
    ['1M', 1e6],
    ['1e-3', 0.001],
    ['-5', -5],
    ['3.3 V', 3.3],
  ])('parseEngineering(%s) → %d', (text, value) => {
    const r = parseEngineering(text);
    expect(r).toEqual({ ok: true, value });
  });

  test('parseEngineering("abc") → error naming the input and showing examples', () => {
    expect(parseEngineering('abc')).toEqual({
      ok: false,
      error: '"abc" is not a number (try 4k7, 2.2u or 10 ms)',
    });
    expect(parseEngineering('  ')).toEqual({ ok: false, error: 'enter a number' });
  });

  test('parseEngineering("1e400") → error, never Infinity', () => {
    expect(parseEngineering('1e400')).toEqual({ ok: false, error: '"1e400" is too large' });
  });
});

describe('formatEngineering', () => {
  test.each([
    [100_000, 'Ω', '100 kΩ'],
    [2.2e-5, 'F', '22 µF'],
    [0.0005, 's', '500 µs'],
    [24, 'V', '24 V'],
    [1e-7, 'F', '100 nF'],
    [0, 's', '0 s'],
    [0.9999, '', '1'],
  ])('formatEngineering(%d, %s) → %s', (value, unit, text) => {
    expect(formatEngineering(value, unit)).toBe(text);
  });
});
