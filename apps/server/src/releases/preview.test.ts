import { randomUUID } from 'node:crypto';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as current from '@wickstone/calc-core';
import {
  createTestApp,
  liveWidget,
  seedOrgWithTeam,
  store,
  TestClient,
  type FixtureOrg,
  type FixtureWidget,
  type TestApp,
} from '../../testing/index.js';
import { runRowFrom } from '../runs/invent.js';
import type { RunRow } from '../runs/store.js';
import type { AnswerEngine } from './answers.js';
import { compareEngines, readPreviewRuns } from './preview.js';
import type { RunEngine } from './service.js';

/*
 * The upgrade preview's two sides over runs stored in the real database: the current engine's
 * answers taken from the stored server results where the engine that recorded them is that very
 * version, run again where not; the candidate engine's `compute` used when it has one.
 */

const SITE = 'https://www.quarrymead-damp.example';
/** The committed, published 0.1.0: the widgets' current engine here. */
const published = createRequire(import.meta.url)(
  fileURLToPath(new URL('../../../../releases/0.1.0/engine.mjs', import.meta.url)),
) as RunEngine;

/** An engine that counts its calls, so a test can see which runs it was asked for. */
function counting(engine: RunEngine) {
  const calls = { calculate: 0 };
  const counted: RunEngine = {
    VERSION: engine.VERSION,
    getCalculator: engine.getCalculator,
    calculate: (id, inputs) => {
      calls.calculate += 1;
      return engine.calculate(id, inputs);
    },
  };
  return { engine: counted, calls };
}

/**
 * A candidate engine with `compute` (as calc-core 0.3.0's engine has): this checkout's calc-core,
 * with a change of its own so a preview has something to find. Below a 45° contact angle the
 * corrected rise reads 0.2 % higher; `calculate` throws, so a test fails if the preview calls it.
 */
function candidateWithCompute() {
  const calls = { compute: 0 };
  const engine: AnswerEngine = {
    VERSION: '9.9.9-test',
    getCalculator: current.getCalculator,
    calculate: () => {
      throw new Error('the preview must use compute when the engine has it');
    },
    compute: (id, inputs) => {
      calls.compute += 1;
      const r = current.calculate(id, inputs as Record<string, number | string>);
      const angle = (inputs as { contactAngleDeg?: number }).contactAngleDeg ?? 0;
      const corrected = r.outputs.riseCorrected;
      return {
        outputs:
          angle < 45 && typeof corrected === 'number' ? { ...r.outputs, riseCorrected: corrected * 1.002 } : r.outputs,
        warnings: r.warnings,
      };
    },
  };
  return { engine, calls };
}

describe('upgrade preview: the current engine’s recorded answers, the candidate’s compute', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let owner: TestClient;
  let recordedWidget: FixtureWidget;
  let rerunWidget: FixtureWidget;
  /** The same inputs, in the same order, for both widgets; some repeat. */
  const inputsList = Array.from({ length: 40 }, (_, i) => ({
    diameter: [0.0003, 0.0008, 0.0015, 0.002, 0.005][i % 5] as number,
    liquid: ['water', 'ethanol'][Math.floor(i / 5) % 2] as string,
    contactAnglePreset: 'custom',
    contactAngleDeg: [0, 20, 60, 90][Math.floor(i / 10) % 4] as number,
  }));
  const at = (i: number) => new Date(Date.UTC(2026, 10, 20, 9, 0, i));

  /** A run of `w` as the embed API stores it, its server result computed by 0.1.0's engine. */
  const rowOf = (w: FixtureWidget, i: number): RunRow => {
    const result = published.calculate('tube-rise', inputsList[i] as Record<string, number | string>);
    return runRowFrom({ ...w, release: '0.1.0' }, result, { id: randomUUID(), createdAt: at(i), origin: SITE });
  };

  beforeAll(async () => {
    t = await createTestApp();
    org = await seedOrgWithTeam();
    owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    recordedWidget = await liveWidget(owner, org.id, 'Basement wall, recorded', 'tube-rise', [SITE]);
    rerunWidget = await liveWidget(owner, org.id, 'Basement wall, re-run', 'tube-rise', [SITE]);
    // Every run of the first widget keeps the server result 0.1.0's engine recorded at ingest.
    await store(
      t.db.sequelize,
      inputsList.map((_, i) => rowOf(recordedWidget, i)),
    );
    // The second widget's runs, with the same inputs: a third made on another release (their
    // stored result is another engine's, given different figures here so that using it would
    // show), a third stored with a result that lacks its outputs, a third with no result at all.
    await store(
      t.db.sequelize,
      inputsList.map((_, i) => {
        const row = rowOf(rerunWidget, i);
        const server = row.serverResult as { outputs: Record<string, number | null> };
        if (i % 3 === 0)
          row.serverResult = {
            ...row.serverResult,
            version: '0.0.9',
            outputs: Object.fromEntries(Object.entries(server.outputs).map(([k, v]) => [k, v === null ? 1 : v * 1.5])),
          };
        else if (i % 3 === 1) row.serverResult = { version: published.VERSION, warnings: [] };
        else row.serverResult = null;
        return row;
      }),
    );
  }, 120_000);
  afterAll(async () => {
    await t?.close();
  });

  it('reads only what a preview needs: inputs, the stored result’s engine version, outputs and warning codes', async () => {
    const runs = await readPreviewRuns(t.db.sequelize, org.id, recordedWidget.id);
    expect(runs).toHaveLength(inputsList.length);
    // Newest first, the inputs as stored (the sent ones, defaults filled in).
    expect(JSON.parse(runs[0]?.inputs ?? 'null')).toMatchObject(inputsList[inputsList.length - 1] as object);
    expect(runs[0]?.recorded?.version).toBe(published.VERSION);
    const expected = published.calculate('tube-rise', inputsList[inputsList.length - 1] as Record<string, number | string>);
    expect(runs[0]?.recorded?.outputs).toEqual(expected.outputs);
    expect(runs[0]?.recorded?.warnings).toEqual(expected.warnings.map((w) => w.code));
    expect(Object.keys(runs[0] ?? {}).sort()).toEqual(['createdAt', 'id', 'inputs', 'recorded']);
  });

  it('gives the same figures whether the current engine’s answers are recorded or run again', async () => {
    /** The preview of one widget's runs, with fresh counting engines on both sides. */
    const previewOf = async (widgetId: number) => {
      const from = counting(published);
      const to = candidateWithCompute();
      const runs = await readPreviewRuns(t.db.sequelize, org.id, widgetId);
      return { p: compareEngines(from.engine, to.engine, 'tube-rise', runs), from: from.calls, to: to.calls };
    };
    const { p: recorded, from: fromRecorded, to: toA } = await previewOf(recordedWidget.id);
    const { p: rerun, from: fromRerun, to: toB } = await previewOf(rerunWidget.id);
    const distinct = new Set(inputsList.map((x) => JSON.stringify(x))).size;

    // Recorded: the current engine is not run at all; every answer is the stored one.
    expect(recorded.fromSide).toEqual({ recorded: inputsList.length, rerun: 0 });
    expect(fromRecorded.calculate).toBe(0);
    expect(recorded.note).toMatch(/^The current engine's answers are the ones recorded/);
    // Re-run: runs of another release, a result without outputs, no result: all run again (each
    // distinct input once).
    expect(rerun.fromSide).toEqual({ recorded: 0, rerun: inputsList.length });
    expect(fromRerun.calculate).toBe(distinct);
    // The candidate ran through compute, each distinct input once, on both.
    expect(toA.compute).toBe(distinct);
    expect(toB.compute).toBe(distinct);
    expect(recorded.distinctInputs).toBe(distinct);

    // The same figures either way (run ids aside: each widget has its own runs, in the same order).
    const byIndex = async (widgetId: number) =>
      new Map((await readPreviewRuns(t.db.sequelize, org.id, widgetId)).map((r, i) => [r.id, i]));
    const indexA = await byIndex(recordedWidget.id);
    const indexB = await byIndex(rerunWidget.id);
    const figures = (p: typeof recorded, index: Map<string, number>) => ({
      runs: p.runs,
      refused: p.refused,
      runsChanged: p.runsChanged,
      outputs: p.outputs,
      warnings: p.warnings,
      topRuns: p.topRuns.map((r) => ({ ...r, runId: index.get(r.runId) })),
    });
    expect(figures(rerun, indexB)).toEqual(figures(recorded, indexA));
    // And they are the candidate's change: runs below 45° with a corrected rise shown change it by
    // 0.2 %, no others.
    const moved = inputsList.filter(
      (x) => x.contactAngleDeg < 45 && typeof current.calculate('tube-rise', x).outputs.riseCorrected === 'number',
    ).length;
    expect(moved).toBeGreaterThan(0);
    expect(recorded.runsChanged).toBe(moved);
    expect(recorded.outputs.map((o) => o.id)).toEqual(['riseCorrected']);
    expect(recorded.outputs[0]?.largestRelativeChange).toBeCloseTo(0.002, 12);
  });

  it('uses the stored result only when its engine is the current engine’s version, and then as stored', async () => {
    // Read as an engine of another version: every stored result is another engine's, so all re-run.
    const other = counting({ ...published, VERSION: `${published.VERSION}-other` });
    const p = compareEngines(
      other.engine,
      candidateWithCompute().engine,
      'tube-rise',
      await readPreviewRuns(t.db.sequelize, org.id, recordedWidget.id),
    );
    expect(p.fromSide).toEqual({ recorded: 0, rerun: inputsList.length });
    expect(other.calls.calculate).toBeGreaterThan(0);
    // The other release's stored figures (1.5 times the real ones) would show as a 50 % change had
    // they been used; re-run, the largest change stays the candidate's 0.2 %.
    const rerun = compareEngines(
      published,
      candidateWithCompute().engine,
      'tube-rise',
      await readPreviewRuns(t.db.sequelize, org.id, rerunWidget.id),
    );
    expect(Math.max(...rerun.topRuns.map((r) => r.largestRelativeChange))).toBeCloseTo(0.002, 12);
  });

  it('falls back to calculate for an engine without compute (a published engine)', () => {
    const runs = inputsList.slice(0, 6).map((x, i) => ({
      id: `run-${i}`,
      createdAt: at(i),
      inputs: JSON.stringify(x),
    }));
    const to = counting(published);
    const p = compareEngines(published, to.engine, 'tube-rise', runs);
    expect(to.calls.calculate).toBe(new Set(runs.map((r) => r.inputs)).size);
    expect(p.runsChanged).toBe(0);
    expect(p.fromSide).toEqual({ recorded: 0, rerun: runs.length });
  });
});
