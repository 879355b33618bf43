import { performance } from 'node:perf_hooks';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { CalculationResult } from '@wickstone/calc-core';
import type { UpgradePreview } from '@wickstone/contracts';
import { Widget } from '../db/models/index.js';
import { AppError, fieldError } from '../errors.js';
import { isCalcInputError, type ReleaseService, type RunEngine } from './service.js';

/** The most runs a preview re-runs: the widget's latest. */
export const PREVIEW_RUN_LIMIT = 100_000;
/** The runs that change most, listed for opening. */
const TOP_RUNS = 20;
const RELATIVE_TOLERANCE = 1e-9;

export interface PreviewRun {
  id: string;
  createdAt: Date;
  /** The stored inputs as the database holds them: identical text is an identical calculation. */
  inputs: string;
}

type Outcome = Pick<CalculationResult, 'outputs' | 'warnings'> | null;

/**
 * Runs a calculator with one engine over many runs' inputs, each distinct input text once: a
 * widget's logged runs repeat the same inputs often (defaults, presets, locked inputs), and an
 * engine is deterministic, so a repeat costs a map lookup. Null where the engine refuses the inputs.
 */
function runAll(engine: RunEngine, calculatorId: string, runs: readonly PreviewRun[]): Outcome[] {
  const seen = new Map<string, Outcome>();
  return runs.map((r) => {
    let out = seen.get(r.inputs);
    if (out === undefined) {
      try {
        const res = engine.calculate(calculatorId, JSON.parse(r.inputs));
        out = { outputs: res.outputs, warnings: res.warnings };
      } catch (e) {
        if (!isCalcInputError(e)) throw e;
        out = null;
      }
      seen.set(r.inputs, out);
    }
    return out;
  });
}

const same = (a: number | null, b: number | null) =>
  a === null || b === null
    ? a === b
    : a === b || Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));

/**
 * What moving from one engine to another changes over these runs: per output, the runs that
 * change and the largest relative change; warnings that appear or disappear; the runs that change
 * most. Pure (no I/O), so the benchmark measures exactly what the route does.
 */
export function compareEngines(
  from: RunEngine,
  to: RunEngine,
  calculatorId: string,
  runs: readonly PreviewRun[],
): Omit<UpgradePreview, 'from' | 'to' | 'limit'> {
  const started = performance.now();
  const before = runAll(from, calculatorId, runs);
  const after = runAll(to, calculatorId, runs);
  const engineMs = performance.now() - started;

  const calc = to.getCalculator(calculatorId) ?? from.getCalculator(calculatorId);
  const labels = new Map((calc?.outputs ?? []).map((o) => [o.id, o.label]));
  const outputs = new Map<string, { runsChanged: number; largest: number | null; withheldNow: number; shownNow: number }>();
  const warnings = new Map<string, { appearsIn: number; disappearsFrom: number }>();
  const changed: UpgradePreview['topRuns'] = [];
  let refused = 0;
  let runsChanged = 0;
  runs.forEach((run, i) => {
    const a = before[i];
    const b = after[i];
    if (!a) return;
    if (!b) {
      refused += 1;
      return;
    }
    let score = -1;
    const moved: { id: string; from: number | null; to: number | null }[] = [];
    for (const id of new Set([...Object.keys(a.outputs), ...Object.keys(b.outputs)])) {
      const x = a.outputs[id] ?? null;
      const y = b.outputs[id] ?? null;
      if (same(x, y)) continue;
      const o = outputs.get(id) ?? { runsChanged: 0, largest: null, withheldNow: 0, shownNow: 0 };
      o.runsChanged += 1;
      let rel = 1;
      if (x !== null && y !== null && x !== 0) {
        rel = Math.abs(y - x) / Math.abs(x);
        o.largest = Math.max(o.largest ?? 0, rel);
      } else if (x !== null && y === null) o.withheldNow += 1;
      else if (x === null && y !== null) o.shownNow += 1;
      outputs.set(id, o);
      moved.push({ id, from: x, to: y });
      score = Math.max(score, rel);
    }
    const codesA = new Set(a.warnings.map((w) => w.code));
    const codesB = new Set(b.warnings.map((w) => w.code));
    const added = [...codesB].filter((c) => !codesA.has(c));
    const removed = [...codesA].filter((c) => !codesB.has(c));
    const tally = (code: string) => {
      const found = warnings.get(code);
      if (found) return found;
      const fresh = { appearsIn: 0, disappearsFrom: 0 };
      warnings.set(code, fresh);
      return fresh;
    };
    for (const c of added) tally(c).appearsIn += 1;
    for (const c of removed) tally(c).disappearsFrom += 1;
    if (!moved.length && !added.length && !removed.length) return;
    runsChanged += 1;
    changed.push({
      runId: run.id,
      createdAt: run.createdAt.toISOString(),
      largestRelativeChange: Math.max(score, 0),
      outputs: moved,
      warningsAdded: added,
      warningsRemoved: removed,
    });
  });
  changed.sort((p, q) => q.largestRelativeChange - p.largestRelativeChange || q.createdAt.localeCompare(p.createdAt));
  return {
    runs: runs.length,
    refused,
    runsChanged,
    outputs: [...outputs].map(([id, o]) => ({
      id,
      label: labels.get(id) ?? id,
      runsChanged: o.runsChanged,
      largestRelativeChange: o.largest,
      withheldNow: o.withheldNow,
      shownNow: o.shownNow,
    })),
    warnings: [...warnings].map(([code, w]) => ({ code, ...w })),
    topRuns: changed.slice(0, TOP_RUNS),
    engineMs: Math.round(engineMs * 10) / 10,
  };
}

/** The upgrade preview of one widget to a candidate release, over its latest logged runs. */
export function createUpgradePreview(deps: { sequelize: Sequelize; releases: ReleaseService }) {
  return async function preview(orgId: number, widgetId: number, candidate?: string): Promise<UpgradePreview> {
    const w = await Widget.findOne({ where: { id: widgetId, organizationId: orgId } });
    if (!w) throw new AppError('not_found', 'Widget not found');
    const to = candidate ?? deps.releases.latest()?.version ?? w.release;
    const target = deps.releases.get(to);
    const toEngine = target ? deps.releases.engine(to) : null;
    if (!target || !toEngine) throw fieldError('query.to', `No release ${to} on this server`);
    if (!target.files[w.calculatorId]) throw fieldError('query.to', `Release ${to} has no ${w.calculatorId} calculator`);
    const fromEngine = deps.releases.engine(w.release);
    if (!fromEngine) throw new AppError('internal', `widget ${w.id} is on release ${w.release}, which this server lacks`);
    const rows = await deps.sequelize.query<{ id: string; created_at: Date; inputs: unknown }>(
      `SELECT id, created_at, inputs FROM runs WHERE organization_id = ? AND widget_id = ?
       ORDER BY created_at DESC, id DESC LIMIT ${PREVIEW_RUN_LIMIT}`,
      { replacements: [orgId, widgetId], type: QueryTypes.SELECT },
    );
    const runs = rows.map((r) => ({
      id: r.id,
      createdAt: new Date(r.created_at),
      inputs: typeof r.inputs === 'string' ? r.inputs : JSON.stringify(r.inputs),
    }));
    const cmp = compareEngines(fromEngine, toEngine, w.calculatorId, runs);
    return {
      from: { version: w.release, engineVersion: fromEngine.VERSION },
      to: { version: to, engineVersion: toEngine.VERSION },
      limit: PREVIEW_RUN_LIMIT,
      ...cmp,
    };
  };
}
