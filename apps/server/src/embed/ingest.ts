import { createHash } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import * as currentEngine from '@wickstone/calc-core';
import { canonicalJson, type CalculationResult, type JsonValue } from '@wickstone/calc-core';
import type { EmbedRunBody, WidgetSettings } from '@wickstone/contracts';
import { AppError } from '../errors.js';
import { isCalcInputError } from '../releases/service.js';
import { storedCalculation } from '../runs/working.js';
import { insertRunStatements, isDuplicateKey, retryOnDeadlock, type RunRow } from '../runs/store.js';
import { addRunsStatements, jsonValue, type Statement } from '../usage/rollups.js';
import {
  accountsStatement,
  allowancesOf,
  monthOf,
  pastAllowance,
  runsInMonthOf,
  runsInMonthStatement,
  type AccountRow,
  type AllowanceFacts,
  type RunsInMonthRow,
} from '../billing/allowance.js';

/*
 * The ingest of visitors' run reports, the platform's hot path, by group commit: reports that
 * arrive while a batch is being stored wait (a few milliseconds) and are stored together by the
 * next one, in one transaction: one lookup of the batch's widgets, one multi-row INSERT of the runs,
 * one upsert per rollup table with the increments summed per key. Each report's request is answered
 * when its batch has committed, so an acknowledged run is stored. Nothing is read per report before
 * it is written: a run id seen before is found by the INSERT's duplicate-key error, and only then
 * are the batch's known ids read.
 */

export interface RunReceipt {
  id: string;
  agreed: boolean;
  duplicate: boolean;
}

export interface RunIngest {
  /** Store one report; resolves once it has committed (or was already stored with the same body). */
  submit(body: EmbedRunBody, origin: string | undefined): Promise<RunReceipt>;
}

export interface IngestOptions {
  /** Reports per batch at most. */
  maxBatch?: number;
  /**
   * Batches being stored at once (1 by default: reports that arrive while one is stored wait for the
   * next, so batches grow with the load and the work per report shrinks).
   */
  maxInFlight?: number;
  /**
   * Called once per committed batch with the runs it newly stored (the plan's run allowance marks
   * and mails from here), before the batch's reports are answered, with each of their
   * organisations' runs in the runs' month and allowance as the batch's transaction read them
   * (after counting the batch): the hook needs no round trip for them. It must not throw: a report
   * is stored whatever it does.
   */
  afterStored?: (
    runs: { id: string; organizationId: number; createdAt: Date }[],
    known: AllowanceFacts,
  ) => Promise<void>;
  /**
   * The engine of a widget release (null when the server has no such release): each run is
   * recomputed with the engine of the release that made it. Without it, the server's own engine.
   */
  engineOf?: (release: string) => RunEngine | null;
}

/** calc-core's runner and registry, as a release's engine module exports them. */
export interface RunEngine {
  calculate: typeof currentEngine.calculate;
  getCalculator: typeof currentEngine.getCalculator;
  /**
   * The numbers alone (outputs, warnings, band, version: `calculate`'s, without the working, the
   * assumptions or the input hash), in engines that have it (calc-core from 0.3): feature-detected.
   */
  compute?: (
    id: string,
    inputs: unknown,
  ) => Pick<CalculationResult, 'calculator' | 'inputs' | 'outputs' | 'warnings' | 'band' | 'version'>;
}

/** What the server's recomputation of a report gives: what is compared, flagged and stored. */
export type ServerCalculation = Pick<
  CalculationResult,
  'calculator' | 'outputs' | 'warnings' | 'band' | 'version' | 'inputHash'
>;

/**
 * calc-core's input hash (SHA-256 of the canonical JSON of calculator and inputs used) with Node's
 * native SHA-256: the same digest the engines make in plain script for the browser.
 */
export const inputHashOf = (calculator: string, inputs: CalculationResult['inputs']): string =>
  createHash('sha256')
    .update(canonicalJson({ calculator, inputs } as unknown as JsonValue))
    .digest('hex');

/** What a report needs of its widget: read once per batch with plain SQL, no model instances. */
interface WidgetFacts {
  id: number;
  organizationId: number;
  calculatorId: string;
  status: string;
  allowedOrigins: string[];
  settings: WidgetSettings;
  release: string;
}

/** A connector connection of the ingest's own (see `takeLane`). */
interface LaneConnection {
  query(sql: string, values?: unknown[]): Promise<unknown>;
  end(): Promise<void>;
  destroy(): void;
  isValid(): boolean;
}

/** A lane left idle this long is closed. */
const LANE_IDLE_MS = 5_000;

interface Pending {
  body: EmbedRunBody;
  origin: string | undefined;
  resolve: (r: RunReceipt) => void;
  reject: (e: unknown) => void;
}

const RELATIVE_TOLERANCE = 1e-9;

const field = (name: string, message: string) =>
  new AppError('validation_failed', `Invalid request: check ${name}`, { fields: [{ field: name, message }] });

/** The same 404 for unknown, draft and paused keys: a key's existence is not revealed. */
const notLive = () => new AppError('not_found', 'No live widget has this key');

const conflict = () =>
  new AppError('conflict', 'This run id was already reported with different content', {
    fields: [{ field: 'body.id', message: 'Already used for another run' }],
  });

function close(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
}

/** Where the client's result and the server's recomputation differ; null when they agree. */
export function compareResults(
  client: EmbedRunBody['result'],
  server: ServerCalculation,
): Record<string, unknown> | null {
  const problems: Record<string, unknown> = {};
  if (client.version !== server.version)
    problems.version = { client: client.version, server: server.version };
  if (client.inputHash !== server.inputHash)
    problems.inputHash = { client: client.inputHash, server: server.inputHash };
  const serverCodes = server.warnings.map((w) => w.code);
  if (client.warnings.join(',') !== serverCodes.join(','))
    problems.warnings = { client: client.warnings, server: serverCodes };
  const outputs: Record<string, unknown> = {};
  for (const k of new Set([...Object.keys(client.outputs), ...Object.keys(server.outputs)])) {
    const c = client.outputs[k];
    const s = server.outputs[k];
    const same =
      c === undefined || s === undefined ? false : c === null || s === null ? c === s : close(c, s);
    if (!same) outputs[k] = { client: c ?? null, server: s ?? null };
  }
  if (Object.keys(outputs).length) problems.outputs = outputs;
  return Object.keys(problems).length ? problems : null;
}

export function bodyHash(body: EmbedRunBody): string {
  return createHash('sha256')
    .update(canonicalJson(body as unknown as JsonValue))
    .digest('hex');
}

/** The live widget a report names, or why the report is refused. */
export function checkWidget<W extends Pick<WidgetFacts, 'status' | 'allowedOrigins'>>(
  w: W | null | undefined,
  origin: string | undefined,
): W {
  if (!w || w.status !== 'live') throw notLive();
  if (!origin || !w.allowedOrigins.includes(origin.toLowerCase())) {
    throw new AppError('forbidden', 'This site is not allowed to embed this widget', {
      origin: origin ?? null,
    });
  }
  return w;
}

/**
 * The calculations an engine made lately, by calculator and inputs (`JSON.stringify` of the inputs
 * as sent: the same inputs in another key order are only a second entry). An engine is a pure
 * function of those, so a report whose inputs another report had (a widget's defaults, a firm's
 * locked inputs, a visitor trying the same figures again) reuses its result instead of running the
 * engine again; a release's engine without `compute` builds the whole working on every call.
 */
export class RecentCalculations {
  private readonly byEngine = new WeakMap<RunEngine, Map<string, ServerCalculation>>();
  constructor(private readonly keep = 2_000) {}

  of(
    engine: RunEngine,
    calculatorId: string,
    inputs: unknown,
    make: () => ServerCalculation,
  ): ServerCalculation {
    let recent = this.byEngine.get(engine);
    if (!recent) this.byEngine.set(engine, (recent = new Map()));
    const key = `${calculatorId}\n${JSON.stringify(inputs)}`;
    const hit = recent.get(key);
    if (hit) {
      // Least recently used first: a hit moves to the end.
      recent.delete(key);
      recent.set(key, hit);
      return hit;
    }
    const made = make();
    if (recent.size >= this.keep) recent.delete(recent.keys().next().value as string);
    // Shared by every report with these inputs: nobody may change it.
    recent.set(key, Object.freeze(made));
    return made;
  }
}

/** The server's own calculation of a report; a 400 naming the input when it cannot be made. */
export function recompute(
  w: Pick<WidgetFacts, 'id' | 'calculatorId' | 'settings'>,
  body: EmbedRunBody,
  engine: RunEngine = currentEngine,
  recent?: RecentCalculations,
): ServerCalculation {
  const calc = engine.getCalculator(w.calculatorId);
  if (!calc) throw new AppError('internal', `widget ${w.id} names a calculator this server lacks`);
  // A locked or hidden input is the firm's choice: a visitor's report may not change it.
  for (const [id, s] of Object.entries(w.settings.inputs)) {
    if (s.mode === 'editable' || s.default === undefined) continue;
    const sent = body.inputs[id];
    if (sent !== undefined && sent !== s.default)
      throw field(`body.inputs.${id}`, 'This input is fixed by the widget');
  }
  const make = (): ServerCalculation => {
    // The working is never needed here (runs do not store it): the engine's numbers alone where it
    // can give them, with the input hash made natively.
    if (!engine.compute) return storedCalculation(engine.calculate(w.calculatorId, body.inputs));
    const r = engine.compute(w.calculatorId, body.inputs);
    const { calculator, outputs, warnings, band, version } = r;
    return { calculator, outputs, warnings, band, version, inputHash: inputHashOf(calculator, r.inputs) };
  };
  try {
    return recent ? recent.of(engine, w.calculatorId, body.inputs, make) : make();
  } catch (e) {
    if (!isCalcInputError(e)) throw e;
    const fields = e.issues.map((i) => ({ field: `body.inputs.${i.field}`, message: i.message }));
    throw new AppError(
      'validation_failed',
      `Invalid request: check ${fields.map((f) => f.field).join(', ')}`,
      { fields },
    );
  }
}

interface WidgetRow {
  id: number;
  organization_id: number;
  public_key: string;
  calculator_id: string;
  status: string;
  allowed_origins: unknown;
  settings: unknown;
  release: string;
}

/**
 * A digest of everything a report's handling reads from its widget, computed by the database: the
 * batch's transaction reads it again (under a shared lock) to show the facts it used are current.
 */
const WIDGET_VERSION =
  "MD5(CONCAT_WS('|', id, organization_id, calculator_id, status, allowed_origins, settings, `release`)) AS version";

interface CachedWidget {
  facts: WidgetFacts;
  version: string;
}

async function widgetsByKey(sequelize: Sequelize, keys: string[]): Promise<Map<string, CachedWidget>> {
  const rows = await sequelize.query<WidgetRow & { version: string }>(
    `SELECT id, organization_id, public_key, calculator_id, status, allowed_origins, settings, \`release\`, ${WIDGET_VERSION}
     FROM widgets WHERE public_key IN (?)`,
    { replacements: [keys], type: QueryTypes.SELECT },
  );
  return new Map(
    rows.map((r) => [
      r.public_key,
      {
        version: r.version,
        facts: {
          id: Number(r.id),
          organizationId: Number(r.organization_id),
          calculatorId: r.calculator_id,
          status: r.status,
          allowedOrigins: jsonValue<string[]>(r.allowed_origins),
          settings: jsonValue<WidgetSettings>(r.settings),
          release: r.release,
        },
      },
    ]),
  );
}

/** One report made ready to store. */
interface Prepared {
  item: Pending;
  row: RunRow;
}

/** A batch sorted out: rows to store, repeats of an id earlier in the batch, and refusals. */
interface Batch {
  rows: Prepared[];
  followers: { item: Pending; of: Prepared; same: boolean }[];
  refused: { item: Pending; error: unknown }[];
}

type Known = Map<string, { bodyHash: string; agreed: boolean }>;

export function createRunIngest(sequelize: Sequelize, options: IngestOptions = {}): RunIngest {
  const maxBatch = options.maxBatch ?? 500;
  const maxInFlight = options.maxInFlight ?? 1;
  const queue: Pending[] = [];
  let inFlight = 0;
  let scheduled = false;
  /** Live facts of widgets seen lately, checked again inside every batch's transaction. */
  const widgetCache = new Map<string, CachedWidget>();
  const recent = new RecentCalculations();

  /**
   * Turn a batch's reports into rows: the widget checks and recomputation per report (a refusal
   * answers that report alone), and a second report of the same id in the batch follows the first.
   */
  function prepare(batch: Pending[], widgets: Map<string, CachedWidget>, now: Date): Batch {
    const refused: { item: Pending; error: unknown }[] = [];
    const rows: Prepared[] = [];
    const byId = new Map<string, Prepared>();
    const followers: { item: Pending; of: Prepared; same: boolean }[] = [];
    for (const item of batch) {
      try {
        const { body, origin } = item;
        const w = checkWidget(widgets.get(body.publicKey)?.facts, origin);
        const hash = bodyHash(body);
        const first = byId.get(body.id);
        if (first) {
          followers.push({ item, of: first, same: first.row.bodyHash === hash });
          continue;
        }
        // The release whose script made the run (older widgets do not say: their widget's release).
        const release = body.release ?? w.release;
        const engine = options.engineOf ? options.engineOf(release) : currentEngine;
        if (!engine) throw field('body.release', `No widget release ${release} on this server`);
        const server = recompute(w, body, engine, recent);
        const mismatch = compareResults(body.result, server);
        const p: Prepared = {
          item,
          row: {
            id: body.id,
            organizationId: w.organizationId,
            widgetId: w.id,
            calculatorId: w.calculatorId,
            origin: (origin as string).toLowerCase(),
            pageUrl: body.pageUrl ?? null,
            release,
            calcVersion: body.result.version,
            unitSystem: body.unitSystem,
            inputs: body.inputs,
            clientResult: body.result,
            // The figures and warnings, not the working: that is made again where it is shown.
            serverResult: server as unknown as Record<string, unknown>,
            warningCodes: server.warnings.map((x) => x.code),
            hasWarning: server.warnings.length > 0,
            agreed: mismatch === null,
            mismatch,
            inputHash: server.inputHash,
            bodyHash: hash,
            // Chosen here, not by the database, so the rollups count the run on the day it is stored with.
            createdAt: now,
          },
        };
        byId.set(body.id, p);
        rows.push(p);
      } catch (e) {
        refused.push({ item, error: e });
      }
    }
    return { rows, followers, refused };
  }

  /**
   * Connections of the ingest's own ("lanes", one per batch in flight), opened by Sequelize's
   * connection manager with its settings (time zone, type casting) plus multi-statement queries, so
   * that a batch's statements travel as one query: one round trip for the whole batch, then one
   * for COMMIT. They stay in autocommit-off mode, so every batch is a transaction of its own; one
   * left idle for a few seconds is closed. They are outside Sequelize's pool (at most
   * `maxInFlight` more connections per process).
   */
  const idleLanes: { conn: LaneConnection; timer?: NodeJS.Timeout }[] = [];
  const closeLane = (conn: LaneConnection) => void conn.end().catch(() => conn.destroy());
  async function takeLane(): Promise<LaneConnection> {
    for (let idle = idleLanes.pop(); idle; idle = idleLanes.pop()) {
      clearTimeout(idle.timer);
      // One the database closed meanwhile (a restart, a wait_timeout) is dropped, not used.
      if (idle.conn.isValid()) return idle.conn;
      closeLane(idle.conn);
    }
    const config = sequelize.config as unknown as { dialectOptions?: Record<string, unknown> };
    const manager = sequelize.connectionManager as unknown as {
      connect(config: unknown): Promise<LaneConnection>;
    };
    const conn = await manager.connect({
      ...config,
      dialectOptions: { ...config.dialectOptions, multipleStatements: true },
    });
    // Once per lane: every batch on it is then a transaction of its own, ended by COMMIT or ROLLBACK.
    try {
      await conn.query('SET autocommit = 0');
    } catch (e) {
      closeLane(conn);
      throw e;
    }
    return conn;
  }
  function giveBack(conn: LaneConnection): void {
    const lane: { conn: LaneConnection; timer?: NodeJS.Timeout } = { conn };
    lane.timer = setTimeout(() => {
      const i = idleLanes.indexOf(lane);
      if (i >= 0) idleLanes.splice(i, 1);
      closeLane(conn);
    }, LANE_IDLE_MS);
    lane.timer.unref();
    idleLanes.push(lane);
  }

  /**
   * Each organisation's runs in a month and its allowance as the last committed batch read them:
   * the next batch's runs past the allowance are predicted from it, so that they are inserted
   * marked instead of updated after (every run of a firm past its allowance would be written twice).
   */
  const usage = new Map<number, { month: string; runs: number; allowance: number }>();
  function predictedOver(fresh: readonly RunRow[]): Set<string> {
    const over = new Set<string>();
    if (usage.size > 10_000) usage.clear();
    const byOrg = new Map<number, RunRow[]>();
    for (const r of fresh) {
      const mine = byOrg.get(r.organizationId);
      if (mine) mine.push(r);
      else byOrg.set(r.organizationId, [r]);
    }
    for (const [org, mine] of byOrg) {
      const last = usage.get(org);
      if (!last || last.month !== monthOf(mine[0]!.createdAt)) continue;
      for (const r of pastAllowance(mine, last.runs + mine.length, last.allowance)) over.add(r.id);
    }
    return over;
  }

  /**
   * Store the rows in one transaction. Returns, per run id already stored before this batch, its
   * stored body hash and flag: those reports are answered as duplicates or conflicts, not inserted.
   *
   * The statements go as one multi-statement query on a lane: MariaDB runs them in order and stops
   * at the first that fails, leaving the transaction open (autocommit is off) to be rolled back;
   * nothing is committed until the results are checked.
   */
  async function store(
    rows: Prepared[],
    keys: string[],
  ): Promise<{ known: Known; stale: string[]; allowance: AllowanceFacts }> {
    const known: Known = new Map();
    const conn = await takeLane();
    const inList = (n: number) => Array.from({ length: n }, () => '?').join(',');
    try {
      // The batch's runs share one time (see prepare), so one month: its runs per organisation are
      // read last, after the batch is counted, with the organisations' plans, for the allowance hook.
      const orgsOf = (fresh: RunRow[]) => [...new Set(fresh.map((r) => r.organizationId))];
      const counting = (fresh: RunRow[]): Statement[] =>
        fresh.length
          ? [
              accountsStatement(orgsOf(fresh)),
              runsInMonthStatement(orgsOf(fresh), monthOf(fresh[0]!.createdAt)),
            ]
          : [];
      let predicted = new Set<string>();
      const attempt = async (fresh: RunRow[]): Promise<unknown[]> => {
        predicted = predictedOver(fresh);
        const statements: Statement[] = [
          {
            sql: `SELECT public_key, ${WIDGET_VERSION} FROM widgets WHERE public_key IN (${inList(keys.length)}) LOCK IN SHARE MODE`,
            values: keys,
          },
          ...insertRunStatements(fresh, predicted),
          ...addRunsStatements(fresh.map((r) => ({ ...r, led: false }))),
          ...counting(fresh),
        ];
        const results = await conn.query(
          statements.map((st) => st.sql).join(';\n'),
          statements.flatMap((st) => st.values),
        );
        // One result per statement; a lone statement (no run left to store) answers its rows alone.
        return statements.length === 1 ? [results] : (results as unknown[]);
      };
      let fresh = rows.map((p) => p.row);
      let results: unknown[];
      try {
        results = await attempt(fresh);
      } catch (e) {
        if (!isDuplicateKey(e)) throw e;
        await conn.query('ROLLBACK');
        // A locking read sees the latest committed rows, also those another process committed
        // while this batch waited on their keys.
        const ids = fresh.map((r) => r.id);
        const stored = (await conn.query(
          `SELECT id, body_hash, agreed FROM runs WHERE id IN (${inList(ids.length)}) LOCK IN SHARE MODE`,
          ids,
        )) as { id: string; body_hash: string; agreed: number | boolean }[];
        for (const r of stored) known.set(r.id, { bodyHash: r.body_hash, agreed: Boolean(Number(r.agreed)) });
        fresh = fresh.filter((r) => !known.has(r.id));
        results = await attempt(fresh);
      }
      const current = new Map(
        (results[0] as { public_key: string; version: string }[]).map((r) => [r.public_key, r.version]),
      );
      const stale = keys.filter((k) => current.get(k) !== widgetCache.get(k)?.version);
      const allowance: AllowanceFacts = fresh.length
        ? {
            allowances: allowancesOf(orgsOf(fresh), results[results.length - 2] as AccountRow[]),
            runs: runsInMonthOf(results[results.length - 1] as RunsInMonthRow[]),
            marked: true,
          }
        : { allowances: new Map(), runs: new Map() };
      if (stale.length) await conn.query('ROLLBACK');
      else {
        // Runs past the plan's allowance are marked in their own transaction: inserted marked as
        // predicted, and where the counts read after the insert say otherwise (another process's
        // runs, a new plan, a new month) put right in the round trip that commits it. No run is
        // ever seen marked wrongly, and marking costs no commit of its own.
        const over = new Set(
          orgsOf(fresh).flatMap((org) =>
            pastAllowance(
              fresh.filter((r) => r.organizationId === org),
              allowance.runs.get(org) ?? 0,
              allowance.allowances.get(org) ?? Infinity,
            ).map((r) => r.id),
          ),
        );
        const mark = [...over].filter((id) => !predicted.has(id));
        const unmark = [...predicted].filter((id) => !over.has(id));
        const fixes: Statement[] = [
          ...(mark.length
            ? [
                {
                  sql: `UPDATE runs SET over_allowance = 1 WHERE id IN (${inList(mark.length)})`,
                  values: mark,
                },
              ]
            : []),
          ...(unmark.length
            ? [
                {
                  sql: `UPDATE runs SET over_allowance = 0 WHERE id IN (${inList(unmark.length)})`,
                  values: unmark,
                },
              ]
            : []),
          { sql: 'COMMIT', values: [] },
        ];
        await conn.query(
          fixes.map((st) => st.sql).join(';\n'),
          fixes.flatMap((st) => st.values),
        );
        for (const org of orgsOf(fresh))
          usage.set(org, {
            month: monthOf(fresh[0]!.createdAt),
            runs: allowance.runs.get(org) ?? 0,
            allowance: allowance.allowances.get(org) ?? Infinity,
          });
      }
      giveBack(conn);
      return { known, stale, allowance };
    } catch (e) {
      // Nothing committed; a connection in an unknown state is closed, not used again.
      await conn.query('ROLLBACK').catch(() => undefined);
      closeLane(conn);
      throw e;
    }
  }

  /** Fetch these widgets' facts into the cache (a key no widget has is left out of it). */
  async function refresh(keys: string[]): Promise<void> {
    for (const k of keys) widgetCache.delete(k);
    if (widgetCache.size > 10_000) widgetCache.clear();
    for (const [k, v] of await widgetsByKey(sequelize, keys)) widgetCache.set(k, v);
  }

  async function flush(batch: Pending[]): Promise<void> {
    try {
      const keys = [...new Set(batch.map((b) => b.body.publicKey))];
      const missing = keys.filter((k) => !widgetCache.has(k));
      if (missing.length) await refresh(missing);
      let prepared: Batch;
      let known: Known;
      let allowance: AllowanceFacts;
      for (let attempt = 1; ; attempt++) {
        prepared = prepare(batch, widgetCache, new Date());
        const stored = await retryOnDeadlock(() => store(prepared.rows, keys));
        if (!stored.stale.length) {
          known = stored.known;
          allowance = stored.allowance;
          break;
        }
        // A widget changed since its facts were cached: nothing was stored; sort the batch out again.
        if (attempt >= 3)
          throw new AppError('service_unavailable', 'Widget settings are changing: try again');
        await refresh(stored.stale);
      }
      if (options.afterStored) {
        const fresh = prepared.rows
          .filter(({ row }) => !known.has(row.id))
          .map(({ row }) => ({ id: row.id, organizationId: row.organizationId, createdAt: row.createdAt }));
        if (fresh.length) await options.afterStored(fresh, allowance);
      }
      for (const { item, error } of prepared.refused) item.reject(error);
      for (const { item, row } of prepared.rows) {
        const before = known.get(row.id);
        if (!before) item.resolve({ id: row.id, agreed: row.agreed, duplicate: false });
        else if (before.bodyHash === row.bodyHash)
          item.resolve({ id: row.id, agreed: before.agreed, duplicate: true });
        else item.reject(conflict());
      }
      for (const { item, of, same } of prepared.followers) {
        const before = known.get(of.row.id);
        if (same && (!before || before.bodyHash === of.row.bodyHash))
          item.resolve({ id: of.row.id, agreed: before ? before.agreed : of.row.agreed, duplicate: true });
        else item.reject(conflict());
      }
    } catch (e) {
      // Nothing of the batch committed.
      for (const item of batch) item.reject(e);
    }
  }

  function kick(): void {
    if (scheduled || !queue.length || inFlight >= maxInFlight) return;
    scheduled = true;
    // The rest of this turn of the event loop joins the batch.
    setImmediate(() => {
      scheduled = false;
      if (!queue.length || inFlight >= maxInFlight) return;
      const batch = queue.splice(0, maxBatch);
      inFlight += 1;
      void flush(batch).finally(() => {
        inFlight -= 1;
        kick();
      });
      kick();
    });
  }

  return {
    submit(body, origin) {
      return new Promise<RunReceipt>((resolve, reject) => {
        queue.push({ body, origin, resolve, reject });
        kick();
      });
    },
  };
}
