import { performance } from 'node:perf_hooks';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { UpgradePreview } from '@wickstone/contracts';
import { Widget } from '../db/models/index.js';
import { AppError, fieldError } from '../errors.js';
import { answersOf, type Answer, type AnswerEngine } from './answers.js';
import { answersSpread } from './parallel.js';
import type { ReleaseService } from './service.js';

/** The most runs a preview re-runs: the widget's latest. */
export const PREVIEW_RUN_LIMIT = 100_000;
/** The runs that change most, listed for opening. */
const TOP_RUNS = 20;
const RELATIVE_TOLERANCE = 1e-9;

/** What the server recorded at ingest for a run: its stored server result's engine and answer. */
export interface RecordedAnswer {
  /** The calc-core version of the engine that computed the stored server result. */
  version: string | null;
  /** Its outputs; null when the stored result has none. */
  outputs: Record<string, number | null> | null;
  warnings: string[];
}

export interface PreviewRun {
  id: string;
  createdAt: Date;
  /** The stored inputs as the database holds them: identical text is an identical calculation. */
  inputs: string;
  /** The stored server result, when there is one. */
  recorded?: RecordedAnswer | null;
}

/** The answers of both engines for each run, with where they came from and what they cost. */
export interface EngineAnswers {
  before: (Answer | null)[];
  after: (Answer | null)[];
  /** Runs whose current-engine answer is the one recorded at ingest by that very engine. */
  recorded: number;
  /** Runs the current engine was run for (another release made them, or nothing usable was stored). */
  rerun: number;
  /** Distinct input texts the candidate engine ran. */
  distinct: number;
  fromMs: number;
  toMs: number;
}

/**
 * The current engine's answer for each run: the stored server result when the engine that
 * recorded it at ingest is this engine's version (it is this engine's answer for those very inputs,
 * so computing it again would only repeat it), else a re-run, each distinct input text once.
 */
export function fromAnswers(
  from: AnswerEngine,
  calculatorId: string,
  runs: readonly PreviewRun[],
): Pick<EngineAnswers, 'before' | 'recorded' | 'rerun' | 'fromMs'> {
  const started = performance.now();
  const before: (Answer | null)[] = new Array<Answer | null>(runs.length).fill(null);
  const todo: number[] = [];
  runs.forEach((r, i) => {
    const rec = r.recorded;
    if (rec && rec.version === from.VERSION && rec.outputs) before[i] = { outputs: rec.outputs, warnings: rec.warnings };
    else todo.push(i);
  });
  const { texts, index } = distinctInputs(todo.map((i) => runs[i] as PreviewRun));
  const answers = answersOf(from, calculatorId, texts);
  todo.forEach((runIndex, k) => (before[runIndex] = answers[index[k] as number] as Answer | null));
  return { before, recorded: runs.length - todo.length, rerun: todo.length, fromMs: performance.now() - started };
}

/** The distinct input texts of these runs, in first-seen order, and each run's index among them. */
export function distinctInputs(runs: readonly Pick<PreviewRun, 'inputs'>[]): { texts: string[]; index: Int32Array } {
  const seen = new Map<string, number>();
  const texts: string[] = [];
  const index = new Int32Array(runs.length);
  runs.forEach((r, i) => {
    let k = seen.get(r.inputs);
    if (k === undefined) {
      k = texts.length;
      texts.push(r.inputs);
      seen.set(r.inputs, k);
    }
    index[i] = k;
  });
  return { texts, index };
}

/**
 * Both engines' answers, the candidate's spread over worker threads when its distinct inputs are
 * many (`answersSpread`; `toPath` is its module for the workers to load).
 */
export async function engineAnswersSpread(
  from: AnswerEngine,
  to: AnswerEngine,
  toPath: string | null,
  calculatorId: string,
  runs: readonly PreviewRun[],
  threads?: number,
): Promise<EngineAnswers> {
  const fromSide = fromAnswers(from, calculatorId, runs);
  const started = performance.now();
  const { texts, index } = distinctInputs(runs);
  const distinct = await answersSpread(to, toPath, calculatorId, texts, threads);
  const after = Array.from(index, (k) => distinct[k] as Answer | null);
  return { ...fromSide, after, distinct: texts.length, toMs: performance.now() - started };
}

/** Both engines' answers on one thread. */
export function engineAnswers(
  from: AnswerEngine,
  to: AnswerEngine,
  calculatorId: string,
  runs: readonly PreviewRun[],
): EngineAnswers {
  const fromSide = fromAnswers(from, calculatorId, runs);
  const started = performance.now();
  const { texts, index } = distinctInputs(runs);
  const distinct = answersOf(to, calculatorId, texts);
  const after = Array.from(index, (k) => distinct[k] as Answer | null);
  return { ...fromSide, after, distinct: texts.length, toMs: performance.now() - started };
}

const same = (a: number | null, b: number | null) =>
  a === null || b === null
    ? a === b
    : a === b || Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));

type Comparison = Pick<UpgradePreview, 'runs' | 'refused' | 'runsChanged' | 'outputs' | 'warnings' | 'topRuns'>;

/**
 * What moving from one engine to another changes over these runs, from both engines' answers: per
 * output, the runs that change and the largest relative change; warnings that appear or disappear;
 * the runs that change most. Pure (no I/O).
 */
export function compareAnswers(
  runs: readonly PreviewRun[],
  before: readonly (Answer | null)[],
  after: readonly (Answer | null)[],
  labels: ReadonlyMap<string, string>,
): Comparison {
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
    const check = (id: string) => {
      const x = a.outputs[id] ?? null;
      const y = b.outputs[id] ?? null;
      if (same(x, y)) return;
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
    };
    for (const id in a.outputs) check(id);
    for (const id in b.outputs) if (!(id in a.outputs)) check(id);
    // Most runs keep the same warnings in the same order: no sets to build for them.
    const sameWarnings =
      a.warnings.length === b.warnings.length && a.warnings.every((c, k) => c === b.warnings[k]);
    const codesA = sameWarnings ? null : new Set(a.warnings);
    const codesB = sameWarnings ? null : new Set(b.warnings);
    const added = codesA && codesB ? [...codesB].filter((c) => !codesA.has(c)) : [];
    const removed = codesA && codesB ? [...codesA].filter((c) => !codesB.has(c)) : [];
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
  };
}

const ms = (x: number) => Math.round(x * 10) / 10;

/** The sentence a preview carries about how it was made. */
export function previewNote(a: Pick<EngineAnswers, 'recorded' | 'rerun' | 'distinct'>): string {
  return (
    `The current engine's answers are the ones recorded when each run was stored (${a.recorded.toLocaleString('en-GB')} runs); ` +
    `${a.rerun.toLocaleString('en-GB')} runs made on another release, or stored without a result, were run again with it. ` +
    `The candidate engine ran each of the ${a.distinct.toLocaleString('en-GB')} distinct inputs once.`
  );
}

/**
 * The comparison of one engine with another over these runs, on one thread: what the route makes
 * (it may spread the candidate engine's share over worker threads), and what the benchmark times.
 */
export function compareEngines(
  from: AnswerEngine,
  to: AnswerEngine,
  calculatorId: string,
  runs: readonly PreviewRun[],
): Omit<UpgradePreview, 'from' | 'to' | 'limit' | 'readMs'> {
  const answers = engineAnswers(from, to, calculatorId, runs);
  return summarise(from, to, calculatorId, runs, answers);
}

export function summarise(
  from: AnswerEngine,
  to: AnswerEngine,
  calculatorId: string,
  runs: readonly PreviewRun[],
  answers: EngineAnswers,
): Omit<UpgradePreview, 'from' | 'to' | 'limit' | 'readMs'> {
  const calc = to.getCalculator(calculatorId) ?? from.getCalculator(calculatorId);
  const labels = new Map((calc?.outputs ?? []).map((o) => [o.id, o.label]));
  return {
    ...compareAnswers(runs, answers.before, answers.after, labels),
    fromSide: { recorded: answers.recorded, rerun: answers.rerun },
    distinctInputs: answers.distinct,
    engineMs: ms(answers.fromMs + answers.toMs),
    note: previewNote(answers),
  };
}

/** A JSON column or JSON_EXTRACT value as the connector hands it over: text or already parsed. */
function jsonOf<T>(v: unknown): T | null {
  if (v === null || v === undefined) return null;
  if (typeof v !== 'string') return v as T;
  try {
    return JSON.parse(v) as T;
  } catch {
    return null;
  }
}

interface RunRow {
  id: string;
  created_at: Date;
  inputs: unknown;
  recorded_version: string | null;
  recorded_outputs: unknown;
  warning_codes: unknown;
}

/**
 * The widget's latest runs, only what a preview reads: inputs, and from the stored server result
 * its engine version and outputs (never its working text); the warning codes the ingest kept
 * beside it.
 */
export async function readPreviewRuns(
  sequelize: Sequelize,
  orgId: number,
  widgetId: number,
  limit = PREVIEW_RUN_LIMIT,
): Promise<PreviewRun[]> {
  const rows = await sequelize.query<RunRow>(
    `SELECT id, created_at, inputs,
            JSON_VALUE(server_result, '$.version') AS recorded_version,
            JSON_EXTRACT(server_result, '$.outputs') AS recorded_outputs,
            warning_codes
     FROM runs WHERE organization_id = ? AND widget_id = ?
     ORDER BY created_at DESC, id DESC LIMIT ${Number(limit)}`,
    { replacements: [orgId, widgetId], type: QueryTypes.SELECT },
  );
  return rows.map((r) => {
    const outputs = jsonOf<Record<string, number | null>>(r.recorded_outputs);
    const usable = outputs !== null && typeof outputs === 'object' && !Array.isArray(outputs);
    return {
      id: r.id,
      createdAt: new Date(r.created_at),
      inputs: typeof r.inputs === 'string' ? r.inputs : JSON.stringify(r.inputs),
      recorded:
        r.recorded_version === null && !usable
          ? null
          : {
              version: r.recorded_version,
              outputs: usable ? outputs : null,
              warnings: jsonOf<string[]>(r.warning_codes) ?? [],
            },
    };
  });
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
    const readStarted = performance.now();
    const runs = await readPreviewRuns(deps.sequelize, orgId, widgetId);
    const readMs = performance.now() - readStarted;
    const answers = await engineAnswersSpread(fromEngine, toEngine, deps.releases.enginePath(to), w.calculatorId, runs);
    const cmp = summarise(fromEngine, toEngine, w.calculatorId, runs, answers);
    return {
      from: { version: w.release, engineVersion: fromEngine.VERSION },
      to: { version: to, engineVersion: toEngine.VERSION },
      limit: PREVIEW_RUN_LIMIT,
      ...cmp,
      readMs: ms(readMs),
    };
  };
}
