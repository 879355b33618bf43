import { createHash } from 'node:crypto';
import { calculate, plainInputs, type CalculationResult } from '@wickstone/calc-core';
import type { WidgetSettings } from '@wickstone/contracts';
import type { RunRow } from './store.js';
import { storedCalculation } from './working.js';

/** The parts of a widget an invented run is made for. */
export interface RunWidget {
  id: number;
  organizationId: number;
  calculatorId: string;
  release: string;
  settings: WidgetSettings;
}

export interface InventedRun {
  id: string;
  createdAt: Date;
  origin: string;
  unitSystem?: 'si' | 'us';
  pageUrl?: string | null;
  /** False for a run whose report the server could not reproduce (its outputs differ). */
  agreed?: boolean;
}

/** A small deterministic generator (mulberry32) in [0, 1): invented data the same on every run. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A v4-shaped UUID made from a seed string, so invented data is the same on every run. */
export function seededUuid(seed: string): string {
  const h = createHash('sha256').update(seed).digest('hex');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-a${h.slice(17, 20)}-${h.slice(20, 32)}`;
}

/**
 * A run row as the embed API would have stored it for this calculation (demo data, the
 * benchmark's million runs, test fixtures): the same columns, from calc-core's own result.
 */
export function runRowFrom(w: RunWidget, result: CalculationResult, run: InventedRun): RunRow {
  const warnings = result.warnings.map((x) => x.code);
  const agreed = run.agreed ?? true;
  const first = Object.keys(result.outputs)[0];
  const outputs =
    agreed || first === undefined
      ? result.outputs
      : { ...result.outputs, [first]: (result.outputs[first] ?? 0) * 1.01 + 1e-6 };
  return {
    id: run.id,
    organizationId: w.organizationId,
    widgetId: w.id,
    calculatorId: w.calculatorId,
    origin: run.origin,
    pageUrl: run.pageUrl === undefined ? `${run.origin}/` : run.pageUrl,
    release: w.release,
    calcVersion: result.version,
    unitSystem: run.unitSystem ?? w.settings.units.system,
    inputs: plainInputs(result.inputs),
    clientResult: { outputs, warnings, inputHash: result.inputHash, version: result.version },
    serverResult: storedCalculation(result) as unknown as Record<string, unknown>,
    warningCodes: warnings,
    hasWarning: warnings.length > 0,
    agreed,
    mismatch:
      agreed || first === undefined
        ? null
        : { outputs: { [first]: { client: outputs[first] ?? null, server: result.outputs[first] ?? null } } },
    inputHash: result.inputHash,
    bodyHash: createHash('sha256').update(`${run.id}:${result.inputHash}`).digest('hex'),
    createdAt: run.createdAt,
  };
}

/** `runRowFrom` with the calculation done here; inputs in canonical units keyed by input id. */
export function inventRun(w: RunWidget, inputs: Record<string, unknown>, run: InventedRun): RunRow {
  return runRowFrom(w, calculate(w.calculatorId, inputs), run);
}

/** The report a widget sends for a calculation, as `POST /api/v1/embed/runs` takes it (tests, benchmarks). */
export function reportOf(
  r: CalculationResult,
  report: { id: string; publicKey: string; unitSystem: 'si' | 'us'; pageUrl?: string },
) {
  return {
    ...report,
    inputs: r.inputs,
    result: {
      outputs: r.outputs,
      warnings: r.warnings.map((x) => x.code),
      inputHash: r.inputHash,
      version: r.version,
    },
  };
}
