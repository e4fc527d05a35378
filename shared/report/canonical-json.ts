// The plan's canonical JSON: the form its content hash is taken over, so the same plan gives the
// same hash whatever the key order or spacing of the file it was read from.

/**
 * JSON with object keys sorted by UTF-16 code units at every level, no whitespace, and numbers and
 * strings written as JSON.stringify writes them (the rules of RFC 8785 for the values a plan holds:
 * finite numbers, strings, booleans, null, arrays and plain objects). Properties whose value is
 * undefined are left out, as JSON.stringify leaves them out. A non-finite number or any other kind
 * of value throws, rather than hashing something that cannot be read back.
 * @example canonicalJson({ b: 1, a: [true, null, 'x'] }) // '{"a":[true,null,"x"],"b":1}'
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value === 'boolean' || typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new Error(`canonical JSON cannot hold the number ${String(value)}`);
    return JSON.stringify(value);
  }
  if (Array.isArray(value)) return `[${value.map((item: unknown) => canonicalJson(item ?? null)).join(',')}]`;
  if (typeof value === 'object' && Object.getPrototypeOf(value) === Object.prototype) {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  throw new Error(`canonical JSON cannot hold a value of type ${typeof value}`);
}
