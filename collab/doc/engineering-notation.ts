/**
 * Engineering input and output: `4k7`, `2.2u`, `10 ms`, `100 kΩ`. Prefixes are the SI decimal
 * prefixes (BIPM SI Brochure, 9th ed., table 7); a prefix letter standing in for the decimal
 * point (`4k7` = 4.7 k, `2n2`, `0R1`) is the resistance/capacitance code of IEC 60062.
 */

const PREFIX: Readonly<Record<string, number>> = {
  f: 1e-15,
  p: 1e-12,
  n: 1e-9,
  u: 1e-6,
  µ: 1e-6,
  μ: 1e-6,
  m: 1e-3,
  '': 1,
  k: 1e3,
  K: 1e3,
  M: 1e6,
  G: 1e9,
};

/** Result of parsing: a number, or a message saying what was wrong. */
export type ParsedNumber = { ok: true; value: number } | { ok: false; error: string };

const UNIT_WORDS = ['ohms', 'ohm', 'Ω', 'Ohm', 'sec', 's', 'F', 'H', 'V', 'A', 'Hz', '%'];

/**
 * Parses engineering input. `unit` (e.g. `'s'`, `'Ω'`) may follow the number and is dropped;
 * a bare number without prefix is taken as is.
 */
export function parseEngineering(text: string, unit?: string): ParsedNumber {
  let s = text.trim().replace(/\s+/g, '');
  if (s.length === 0) return { ok: false, error: 'enter a number' };
  const units = unit ? [unit, ...UNIT_WORDS] : UNIT_WORDS;
  for (const u of units) {
    // Only strip a unit that leaves something before it (`F` alone is not a number anyway).
    if (s.length > u.length && s.endsWith(u)) {
      s = s.slice(0, -u.length);
      break;
    }
  }
  if (/^[0-9]+R[0-9]*$/.test(s)) return finite(Number(s.replace('R', '.')), text);
  const code = /^([0-9]+)([fpnuµμmkKMG])([0-9]+)$/.exec(s);
  if (code) return finite(Number(`${code[1]}.${code[3]}`) * PREFIX[code[2]], text);
  const m = /^([+-]?(?:[0-9]+\.?[0-9]*|\.[0-9]+)(?:[eE][+-]?[0-9]+)?)([fpnuµμmkKMG]?)$/.exec(s);
  if (!m) return { ok: false, error: `"${text}" is not a number (try 4k7, 2.2u or 10 ms)` };
  return finite(Number(m[1]) * PREFIX[m[2]], text);
}

function finite(value: number, text: string): ParsedNumber {
  // Rounding to 12 significant digits removes the binary noise of 4.7 × 1e3 = 4700.000000000001.
  const v = Number(value.toPrecision(12));
  return Number.isFinite(v)
    ? { ok: true, value: v }
    : { ok: false, error: `"${text}" is too large` };
}

const FORMAT_PREFIXES: ReadonlyArray<[number, string]> = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
  [1e-15, 'f'],
];

/** Formats with an SI prefix and up to `digits` significant digits: 1e5, 'Ω' → `100 kΩ`. */
export function formatEngineering(value: number, unit = '', digits = 3): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return unit ? `0 ${unit}` : '0';
  const abs = Math.abs(value);
  const [scale, prefix] = FORMAT_PREFIXES.find(([f]) => abs >= f * 0.9995) ?? [1e-15, 'f'];
  const mantissa = Number((value / scale).toPrecision(digits));
  const suffix = `${prefix}${unit}`;
  return suffix ? `${mantissa} ${suffix}` : String(mantissa);
}
