/**
 * Canonical JSON of a value, the text a scan's spec hash is the SHA-256 of: object keys sorted
 * (by UTF-16 code units, as `Array.prototype.sort` does) at every depth, no whitespace, strings
 * and numbers as `JSON.stringify` writes them (the shortest form that reads back to the same
 * double), arrays in order, `undefined` members left out. For the JSON a spec holds this is the
 * JSON Canonicalization Scheme of RFC 8785, so any JCS library recomputes the same bytes.
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') {
    const text = JSON.stringify(value);
    if (text === undefined) throw new Error(`canonicalJson: ${typeof value} has no JSON form`);
    return text;
  }
  if (Array.isArray(value)) return `[${value.map((item) => (item === undefined ? 'null' : canonicalJson(item))).join(',')}]`;
  const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined);
  entries.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
}
