/**
 * Canonical JSON and its SHA-256, the identity of a snapshot's content: the same plan gives the
 * same hash whatever the key order or the replica it was read from.
 */
import { digest } from 'lib0/hash/sha256';
import { encodeUtf8 } from 'lib0/string';

/**
 * Canonical JSON text: object keys sorted by UTF-16 code units, no whitespace, `undefined`
 * fields left out, -0 written as 0. Loosely the JSON Canonicalization Scheme (RFC 8785) for the
 * values plans contain.
 * @throws TypeError naming the path of a non-finite number or a non-JSON value.
 */
export function canonicalJson(value: unknown, path = '$'): string {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'boolean':
      return value ? 'true' : 'false';
    case 'string':
      return JSON.stringify(value);
    case 'number':
      if (!Number.isFinite(value)) throw new TypeError(`${path}: ${value} is not a JSON number`);
      return JSON.stringify(Object.is(value, -0) ? 0 : value);
    case 'object': {
      if (Array.isArray(value)) {
        return `[${value.map((v, i) => canonicalJson(v === undefined ? null : v, `${path}[${i}]`)).join(',')}]`;
      }
      const obj = value as Record<string, unknown>;
      const keys = Object.keys(obj)
        .filter((k) => obj[k] !== undefined)
        .sort();
      return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(obj[k], `${path}.${k}`)}`).join(',')}}`;
    }
    default:
      throw new TypeError(`${path}: a ${typeof value} is not JSON`);
  }
}

/** Lower-case hex SHA-256 of a UTF-8 string. */
export function sha256Hex(text: string): string {
  const bytes = digest(encodeUtf8(text));
  let hex = '';
  for (const b of bytes) hex += b.toString(16).padStart(2, '0');
  return hex;
}

/** `sha256:<hex>` of the canonical JSON of a plan (or of any JSON value, e.g. plan + intents). */
export function contentHash(planJson: unknown): string {
  return `sha256:${sha256Hex(canonicalJson(planJson))}`;
}
