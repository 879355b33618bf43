import { isDeepStrictEqual } from 'node:util';

export interface Change {
  path: string;
  before: unknown;
  after: unknown;
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/**
 * What changed between two JSON values, as dotted paths down to the leaves that differ
 * (arrays are compared whole: an origin list is one setting, not many).
 */
export function diff(before: unknown, after: unknown, path = ''): Change[] {
  if (isDeepStrictEqual(before, after)) return [];
  if (isRecord(before) && isRecord(after)) {
    const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort();
    return keys.flatMap((k) => diff(before[k], after[k], path ? `${path}.${k}` : k));
  }
  return [{ path, before: before ?? null, after: after ?? null }];
}
