import type { CalculationResult, UnitSystemId } from '@wickstone/calc-core';
import type { EmbedRunBody } from '@wickstone/contracts';

export { newRunId, type RandomSource } from './run-id.js';

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
  /** The widget release that ran the calculation; the server recomputes with that release's engine. */
  release?: string;
}): EmbedRunBody {
  const { id, publicKey, result, unitSystem, href, release } = args;
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
    ...(release === undefined ? {} : { release }),
  };
}
