// The id of a run report, made when the visitor calculates: in the runtime, apart from the
// reporter (which follows with the extras), so a calculation made before they arrive has its id.

/**
 * A random v4 UUID. `crypto.randomUUID` exists only in secure contexts, and a firm's site may
 * still be plain http, so fall back to `getRandomValues` (available everywhere) in the same format.
 */
export interface RandomSource {
  randomUUID?: () => string;
  getRandomValues(array: Uint8Array<ArrayBuffer>): Uint8Array<ArrayBuffer>;
}

export function newRunId(c: RandomSource = crypto): string {
  if (typeof c.randomUUID === 'function') return c.randomUUID();
  const b = c.getRandomValues(new Uint8Array(16));
  b[6] = ((b[6] ?? 0) & 0x0f) | 0x40;
  b[8] = ((b[8] ?? 0) & 0x3f) | 0x80;
  const hex = [...b].map((x) => x.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}
