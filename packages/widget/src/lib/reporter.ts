import type { CalculationResult, UnitSystemId } from '@wickstone/calc-core';
import { buildRunBody, newRunId } from './report.js';
import { request, type Reply, type SendOptions } from './transport.js';

/** A reported run: its id, and whether the server has acknowledged storing it. */
export interface RunReport {
  readonly id: string;
  /** Resolves true once the server answered 2xx (the row is committed), false when it refused or never answered. */
  readonly stored: Promise<boolean>;
}

export interface Reporter {
  /**
   * Reports a calculation; the same inputs in the same units twice running is one run, not two
   * (unless the first report failed). `id`, when given, is the new report's id.
   */
  report(result: CalculationResult, unitSystem: UnitSystemId, id?: string): RunReport;
}

/**
 * Sends run reports to `<api>/api/v1/embed/runs`. Each report has its own id made here, kept
 * across retries so the server stores it once. Pressing Calculate again without changing
 * anything returns the previous report, so analytics count calculations, not clicks.
 */
export function createReporter(args: {
  apiBase: string;
  publicKey: string;
  href: () => string;
  /** The widget release that made the results (sent with each report). */
  release?: string;
  send?: SendOptions;
  makeId?: () => string;
  onReply?: (id: string, reply: Reply) => void;
}): Reporter {
  const makeId = args.makeId ?? (() => newRunId());
  let last: { key: string; report: RunReport; failed: () => boolean } | null = null;
  return {
    report(result, unitSystem, given) {
      const key = `${unitSystem}:${result.inputHash}`;
      if (last !== null && last.key === key && !last.failed()) return last.report;
      const id = given ?? makeId();
      const body = buildRunBody({
        id,
        publicKey: args.publicKey,
        result,
        unitSystem,
        href: args.href(),
        release: args.release,
      });
      // A refused or lost report is not reused: calculating again sends a fresh one.
      let failed = false;
      const stored = request(`${args.apiBase}/api/v1/embed/runs`, body, args.send).then((reply) => {
        args.onReply?.(id, reply);
        failed = reply.status < 200 || reply.status >= 300;
        return !failed;
      });
      const report = { id, stored };
      last = { key, report, failed: () => failed };
      return report;
    },
  };
}
