import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { usageSummarySchema } from '@wickstone/contracts';
import {
  createTestApp,
  seedOrgWithTeam,
  TestClient,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { storeLeadsForRuns, type RunRow } from '../runs/store.js';
import {
  fieldsOf,
  liveWidget,
  PORTAL,
  reportRun,
  runAt,
  SITE,
  store,
  type FixtureWidget,
} from '../../testing/usage.js';

/*
 * The usage summary against a fixture small enough to count by hand. The expected numbers below
 * are written out, not computed: each comes from the table of runs in beforeAll.
 */
describe('usage summary', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let analyst: TestClient;
  let tube: FixtureWidget;
  let soil: FixtureWidget;

  const summary = async (query: string) =>
    usageSummarySchema.parse((await analyst.get(`/orgs/${org.id}/usage/summary?${query}`).expect(200)).body);

  beforeAll(async () => {
    t = await createTestApp();
    org = await seedOrgWithTeam('Brackenridge Ground & Damp');
    const owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    analyst = new TestClient(t.app);
    await analyst.login(org.users.analyst.email, org.users.analyst.password);
    tube = await liveWidget(owner, org.id, 'Rising damp in a pore', 'tube-rise');
    soil = await liveWidget(owner, org.id, 'Slab check', 'soil-capillary-rise');

    //  #  when (UTC)                 widget  site    warning             agreed  lead
    //  1  2026-03-01 10:00           tube    site    -                   yes
    //  2  2026-03-01 11:00           tube    site    BORE_NOT_SMALL      yes     lead
    //  3  2026-03-01 23:59:59.999    tube    portal  BORE_NOT_SMALL      yes
    //  4  2026-03-03 08:00           tube    portal  BORE_TOO_WIDE       no
    //  5  2026-03-05 14:00           soil    site    FINE_GRAINED_SOIL   yes     lead
    //  6  2026-03-07 23:00           soil    site    -                   yes
    //  7  2026-03-08 00:00           tube    site    -                   yes           (after the period)
    //  8  2026-02-28 09:00           tube    site    BORE_NOT_SMALL      yes     lead  (period before)
    //  9  2026-02-22 00:00           soil    site    -                   yes           (period before)
    // 10  2026-02-21 23:59:59.999    tube    site    -                   yes           (before both)
    const runs: RunRow[] = [
      runAt(tube, '2026-03-01T10:00:00.000Z', { diameter: 0.0008 }),
      runAt(tube, '2026-03-01T11:00:00.000Z', { diameter: 0.004 }),
      runAt(tube, '2026-03-01T23:59:59.999Z', { diameter: 0.004 }, { origin: PORTAL }),
      runAt(tube, '2026-03-03T08:00:00.000Z', { diameter: 0.03 }, { origin: PORTAL, agreed: false }),
      runAt(soil, '2026-03-05T14:00:00.000Z', { d10: 0.00002, waterTableDepth: 0.5 }),
      runAt(soil, '2026-03-07T23:00:00.000Z', { d10: 0.0001, waterTableDepth: 1 }),
      runAt(tube, '2026-03-08T00:00:00.000Z', { diameter: 0.0008 }),
      runAt(tube, '2026-02-28T09:00:00.000Z', { diameter: 0.004 }),
      runAt(soil, '2026-02-22T00:00:00.000Z', { d10: 0.0001, waterTableDepth: 1 }),
      runAt(tube, '2026-02-21T23:59:59.999Z', { diameter: 0.0008 }),
    ];
    expect(runs.map((r) => r.warningCodes.join(''))).toEqual([
      '',
      'BORE_NOT_SMALL',
      'BORE_NOT_SMALL',
      'BORE_TOO_WIDE',
      'FINE_GRAINED_SOIL',
      '',
      '',
      'BORE_NOT_SMALL',
      '',
      '',
    ]);
    await store(t.db.sequelize, runs);
    const lead = (run: RunRow) => ({
      lead: {
        organizationId: org.id,
        widgetId: run.widgetId,
        runId: run.id,
        name: 'Owain Brightwell',
        email: 'owain.b@post.example',
        consentText: 'I agree that the firm may contact me about this request.',
        consentAt: run.createdAt,
        origin: run.origin,
        sendCopy: false,
        createdAt: run.createdAt,
      },
      run,
    });
    await t.db.sequelize.transaction((tx) =>
      storeLeadsForRuns(t.db.sequelize, [lead(runs[1]!), lead(runs[4]!), lead(runs[7]!)], tx),
    );
  });
  afterAll(() => t.close());

  it('counts the period by hand: totals, and the week before for comparison', async () => {
    const s = await summary('from=2026-03-01&to=2026-03-07');
    expect(s.from).toBe('2026-03-01');
    expect(s.to).toBe('2026-03-07');
    expect(s.totals).toEqual({ runs: 6, withWarning: 4, withLead: 2, disagreed: 1 });
    expect(s.previous).toEqual({
      from: '2026-02-22',
      to: '2026-02-28',
      totals: { runs: 2, withWarning: 1, withLead: 1, disagreed: 0 },
    });
  });

  it('gives every day of the period, the empty ones as zeros', async () => {
    const s = await summary('from=2026-03-01&to=2026-03-07');
    const zero = { withWarning: 0, withLead: 0, disagreed: 0 };
    expect(s.perDay).toEqual([
      { day: '2026-03-01', runs: 3, withWarning: 2, withLead: 1, disagreed: 0 },
      { day: '2026-03-02', runs: 0, ...zero },
      { day: '2026-03-03', runs: 1, withWarning: 1, withLead: 0, disagreed: 1 },
      { day: '2026-03-04', runs: 0, ...zero },
      { day: '2026-03-05', runs: 1, withWarning: 1, withLead: 1, disagreed: 0 },
      { day: '2026-03-06', runs: 0, ...zero },
      { day: '2026-03-07', runs: 1, ...zero },
    ]);
  });

  it('breaks the period down by widget, calculator and site, busiest first', async () => {
    const s = await summary('from=2026-03-01&to=2026-03-07');
    expect(s.byWidget).toEqual([
      {
        widgetId: tube.id,
        name: 'Rising damp in a pore',
        calculatorId: 'tube-rise',
        runs: 4,
        withWarning: 3,
        withLead: 1,
        disagreed: 1,
      },
      {
        widgetId: soil.id,
        name: 'Slab check',
        calculatorId: 'soil-capillary-rise',
        runs: 2,
        withWarning: 1,
        withLead: 1,
        disagreed: 0,
      },
    ]);
    expect(s.byCalculator).toEqual([
      {
        calculatorId: 'tube-rise',
        title: 'Capillary rise or depression in a tube',
        runs: 4,
        withWarning: 3,
        withLead: 1,
        disagreed: 1,
      },
      {
        calculatorId: 'soil-capillary-rise',
        title: expect.any(String),
        runs: 2,
        withWarning: 1,
        withLead: 1,
        disagreed: 0,
      },
    ]);
    expect(s.bySite).toEqual([
      { origin: SITE, runs: 4, withWarning: 2, withLead: 2, disagreed: 0 },
      { origin: PORTAL, runs: 2, withWarning: 2, withLead: 0, disagreed: 1 },
    ]);
  });

  it('names the warnings raised most often, with what they mean', async () => {
    const s = await summary('from=2026-03-01&to=2026-03-07');
    expect(s.topWarnings.map((w) => [w.code, w.calculatorId, w.runs])).toEqual([
      ['BORE_NOT_SMALL', 'tube-rise', 2],
      ['BORE_TOO_WIDE', 'tube-rise', 1],
      ['FINE_GRAINED_SOIL', 'soil-capillary-rise', 1],
    ]);
    expect(s.topWarnings[0]!.summary).not.toBe('BORE_NOT_SMALL');
  });

  it('narrows everything to one widget', async () => {
    const s = await summary(`from=2026-03-01&to=2026-03-07&widgetId=${soil.id}`);
    expect(s.widgetId).toBe(soil.id);
    expect(s.totals).toEqual({ runs: 2, withWarning: 1, withLead: 1, disagreed: 0 });
    expect(s.previous.totals).toEqual({ runs: 1, withWarning: 0, withLead: 0, disagreed: 0 });
    expect(s.byWidget.map((w) => w.widgetId)).toEqual([soil.id]);
    expect(s.topWarnings.map((w) => w.code)).toEqual(['FINE_GRAINED_SOIL']);
  });

  it('takes a single day, whose comparison is the day before', async () => {
    const s = await summary('from=2026-03-01&to=2026-03-01');
    expect(s.totals.runs).toBe(3);
    expect(s.previous).toEqual({
      from: '2026-02-28',
      to: '2026-02-28',
      totals: { runs: 1, withWarning: 1, withLead: 1, disagreed: 0 },
    });
  });

  it('defaults to the 30 days up to today, with what the embed API stored today', async () => {
    await reportRun(t.app, tube, { diameter: 0.004 });
    const s = await summary('');
    const today = new Date().toISOString().slice(0, 10);
    expect(s.to).toBe(today);
    expect(s.perDay).toHaveLength(30);
    expect(s.perDay.at(-1)).toMatchObject({ day: today, runs: 1, withWarning: 1 });
    expect(s.totals.runs).toBe(1);
  });

  it('names bad dates and a period that is too long or backwards', async () => {
    for (const [query, field] of [
      ['from=2026-03-32', 'query.from'],
      ['from=2026-03-07&to=2026-03-01', 'query.to'],
      ['from=2000-01-01&to=2026-03-01', 'query.to'],
      ['from=2000-01-01', 'query.from'],
      ['widgetId=0', 'query.widgetId'],
    ]) {
      const res = await analyst.get(`/orgs/${org.id}/usage/summary?${query}`).expect(400);
      expect(fieldsOf(res.body), query).toEqual([field]);
    }
  });

  it('reads the rollups only: raw runs deleted behind their back do not change it', async () => {
    const before = await summary('from=2026-03-01&to=2026-03-07');
    await t.db.sequelize.query('DELETE FROM leads WHERE organization_id = ?', {
      replacements: [org.id],
      type: QueryTypes.DELETE,
    });
    await t.db.sequelize.query('DELETE FROM runs WHERE organization_id = ?', {
      replacements: [org.id],
      type: QueryTypes.DELETE,
    });
    expect(await summary('from=2026-03-01&to=2026-03-07')).toEqual(before);
  });
});
