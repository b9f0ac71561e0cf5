import { createHash } from 'node:crypto';

/**
 * Canonical JSON: object keys sorted, no whitespace, numbers in JavaScript's shortest round-trip
 * form (so 1.0 and 1 hash alike), -0 written as 0, undefined members dropped. Non-finite numbers
 * cannot be represented and are refused.
 */
export function canonicalJson(value: unknown): string {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'number':
      if (!Number.isFinite(value)) throw new Error('canonical JSON cannot hold NaN or Infinity');
      return Object.is(value, -0) ? '0' : JSON.stringify(value);
    case 'string':
    case 'boolean':
      return JSON.stringify(value);
    case 'object': {
      if (Array.isArray(value)) return `[${value.map((v) => canonicalJson(v ?? null)).join(',')}]`;
      const entries = Object.entries(value as Record<string, unknown>)
        .filter(([, v]) => v !== undefined)
        .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
      return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
    }
    default:
      throw new Error(`canonical JSON cannot hold a ${typeof value}`);
  }
}

export function sha256Hex(text: string): string {
  return createHash('sha256').update(text).digest('hex');
}

/** Content hash of a version: SHA-256 of the canonical JSON of its definition and check cases. */
export function contentHash(definition: unknown, checkCases: unknown[]): string {
  return sha256Hex(canonicalJson({ definition, checkCases }));
}
