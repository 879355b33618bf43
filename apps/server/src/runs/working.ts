import * as currentEngine from '@wickstone/calc-core';
import type { CalculationResult } from '@wickstone/calc-core';
import { AppError } from '../errors.js';

/*
 * A run keeps what its records need of the server's calculation: the figures, the warnings, the
 * band, the engine version and the input hash. The working (every step's formula, values and
 * source), the assumptions and the cautions are not stored: the engine of the run's release is
 * deterministic, so where they are shown (the run's page, its calculation sheet, the e-mailed copy)
 * they are calculated again from the stored inputs. Rows stored before this still hold them and
 * are shown as stored.
 */

/** The stored part of a calculation result (`runs.server_result`). */
export interface StoredCalculation {
  calculator: string;
  outputs: CalculationResult['outputs'];
  warnings: CalculationResult['warnings'];
  band: CalculationResult['band'];
  version: string;
  inputHash: string;
}

export function storedCalculation(r: StoredCalculation): StoredCalculation {
  return {
    calculator: r.calculator,
    outputs: r.outputs,
    warnings: r.warnings,
    band: r.band,
    version: r.version,
    inputHash: r.inputHash,
  };
}

/** The engine a release's runs were made with (`ReleaseService.engine`); null when the server lacks it. */
export type EngineOf = (release: string) => Pick<typeof currentEngine, 'calculate'> | null;

/** What a run's whole result is made again from. */
export interface StoredRun {
  id: string;
  calculatorId: string;
  release: string;
  inputs: Record<string, unknown>;
  serverResult: Record<string, unknown> | null;
}

const sameOutputs = (a: Record<string, unknown>, b: Record<string, unknown>): boolean => {
  const keys = Object.keys(a);
  return keys.length === Object.keys(b).length && keys.every((k) => a[k] === b[k]);
};

/**
 * The run's whole result, working included: as stored for an older row that holds its working,
 * otherwise calculated again with the engine of the run's release (without `engineOf`, this
 * server's calc-core). Null for a run the server never calculated. A result made again that is not
 * the one stored (another engine version, input hash or figures) is an error, never shown.
 */
export function wholeResult(run: StoredRun, engineOf?: EngineOf): CalculationResult | null {
  const stored = run.serverResult;
  if (!stored) return null;
  if (Array.isArray(stored.working)) return stored as unknown as CalculationResult;
  const engine = engineOf ? engineOf(run.release) : currentEngine;
  if (!engine)
    throw new AppError(
      'internal',
      `run ${run.id} was made by release ${run.release}, which this server lacks`,
    );
  const again = engine.calculate(run.calculatorId, run.inputs);
  if (
    again.version !== stored.version ||
    again.inputHash !== stored.inputHash ||
    !sameOutputs(again.outputs, (stored.outputs ?? {}) as Record<string, unknown>)
  ) {
    throw new AppError('internal', `the working of run ${run.id} could not be made again as it was stored`);
  }
  return again;
}
