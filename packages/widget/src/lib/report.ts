import type { CalculationResult, UnitSystemId } from '@wickstone/calc-core';
import type { EmbedRunBody } from '@wickstone/contracts';

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

/** The page a run came from, when the API will take it (an http(s) URL of at most 2000 characters). */
export function pageUrlFor(href: string): string | undefined {
  if (href.length > 2000 || !/^https?:\/\//i.test(href)) return undefined;
  return href;
}

/**
 * The report of one calculation (`embedRunBodySchema`): the inputs calc-core actually used
 * (canonical, defaults filled in, inputs that do not apply left out), so the server can re-run
 * exactly this calculation and compare.
 */
export function buildRunBody(args: {
  id: string;
  publicKey: string;
  result: CalculationResult;
  unitSystem: UnitSystemId;
  href: string;
}): EmbedRunBody {
  const { id, publicKey, result, unitSystem, href } = args;
  const pageUrl = pageUrlFor(href);
  return {
    id,
    publicKey,
    // A JSON copy (table rows as plain objects): exactly what goes over the wire.
    inputs: JSON.parse(JSON.stringify(result.inputs)) as EmbedRunBody['inputs'],
    unitSystem,
    result: {
      outputs: { ...result.outputs },
      warnings: result.warnings.map((w) => w.code),
      inputHash: result.inputHash,
      version: result.version,
    },
    ...(pageUrl === undefined ? {} : { pageUrl }),
  };
}
