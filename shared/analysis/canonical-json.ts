/**
 * Canonical JSON of a value: object keys sorted (by UTF-16 code units, as `Array.prototype.sort`),
 * no whitespace, numbers and strings as `JSON.stringify` writes them. Two equal results give the
 * same text, whatever the order their fields were built in, so its SHA-256 is a fingerprint.
 */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) {
    return `[${value.map((item) => canonicalJson(item ?? null)).join(',')}]`;
  }
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, item]) => item !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([key, item]) => `${JSON.stringify(key)}:${canonicalJson(item)}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}
