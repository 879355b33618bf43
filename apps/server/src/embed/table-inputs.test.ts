import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { calculate, type TableRow } from '@wickstone/calc-core';
import { errorBodySchema, runDetailSchema, widgetSchema, type Widget } from '@wickstone/contracts';
import {
  createTestApp,
  runReportBody,
  seedOrgWithTeam,
  snapshotTables,
  TestClient,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';

// Run reports whose inputs carry a table (the absorption-coefficient calculator's readings): the
// server recomputes them with calc-core, stores them whole, shows them on the run's page, and
// refuses bad rows with a 400 naming row and column, storing nothing.

const SITE = 'https://lab.fenwick-moisture.example';
const detailsOf = (body: unknown) =>
  errorBodySchema.parse(body).error.details as { fields: { field: string; message: string }[] };

/** An invented test: masses at 0, 5 min, 20 min, 1 h, 2 h, 4 h on a 50 cm² face. */
const readings: TableRow[] = [
  { time: 0, mass: 0.91502 },
  { time: 300, mass: 0.91791 },
  { time: 1200, mass: 0.92045 },
  { time: 3600, mass: 0.92418 },
  { time: 7200, mass: 0.92791 },
  { time: 14400, mass: 0.93316 },
];

describe('run reports with a table of readings', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let owner: TestClient;
  let widget: Widget;

  beforeAll(async () => {
    t = await createTestApp();
    org = await seedOrgWithTeam();
    owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    const created = widgetSchema.parse(
      (
        await owner
          .post(`/orgs/${org.id}/widgets`, {
            name: 'Absorption',
            calculatorId: 'absorption-coefficient',
            allowedOrigins: [SITE],
          })
          .expect(201)
      ).body,
    );
    const settings = structuredClone(created.settings);
    settings.inputs = { faceArea: { mode: 'locked', default: 0.005 } };
    widget = widgetSchema.parse(
      (await owner.patch(`/orgs/${org.id}/widgets/${created.id}`, { status: 'live', settings }).expect(200))
        .body,
    );
  });
  afterAll(() => t.close());

  const report = (body: unknown) =>
    request(t.app)
      .post('/api/v1/embed/runs')
      .set('Origin', SITE)
      .set('Content-Type', 'text/plain;charset=UTF-8')
      .send(JSON.stringify(body));
  const body = (rows: unknown = readings) =>
    runReportBody(widget.publicKey, {
      id: randomUUID(),
      calculatorId: 'absorption-coefficient',
      inputs: { readings: rows as TableRow[], faceArea: 0.005 },
    });

  it('stores the run with its rows, agreed by the server, and the run page shows the inputs table', async () => {
    const sent = body();
    const res = await report(sent).expect(201);
    expect(res.body).toMatchObject({ agreed: true, duplicate: false });
    const detail = runDetailSchema.parse(
      (await owner.get(`/orgs/${org.id}/runs/${sent.id}`).expect(200)).body,
    );
    expect(detail.sentInputs.readings).toEqual(readings);
    const shown = detail.inputs.find((i) => i.id === 'readings');
    expect(shown?.text).toBe('6 rows of time (min), mass (g)');
    expect(shown?.table?.columns.map((c) => c.unit)).toEqual(['min', 'g']);
    // The rows in the widget's units (min, g), as the page shows them.
    expect(shown?.table?.rows.map((r) => r[0])).toEqual([0, 5, 20, 60, 120, 240]);
    expect(shown?.table?.rows[1]?.[1]).toBeCloseTo(917.91, 9);
    const expected = calculate('absorption-coefficient', { readings, faceArea: 0.005 });
    const outputs = detail.outputs.find((o) => o.id === 'absorptionCoefficient');
    expect(outputs?.value).toBeCloseTo(expected.outputs.absorptionCoefficient ?? Number.NaN, 12);
  });

  it.each([
    [
      'a negative mass',
      readings.map((r, i) => (i === 2 ? { ...r, mass: -0.92 } : r)),
      'body.inputs.readings.2.mass',
      /row 3, mass/,
    ],
    [
      'times out of order',
      readings.map((r, i) => (i === 4 ? { ...r, time: 60 } : r)),
      'body.inputs.readings.4.time',
      /row 5, time: must be later/,
    ],
    [
      'a text cell',
      readings.map((r, i) => (i === 1 ? { ...r, mass: 'n/a' } : r)),
      'body.inputs.readings.1.mass',
      /row 2, mass: must be a number/,
    ],
    ['a missing row count', readings.slice(0, 3), 'body.inputs.readings', /at least 5 rows/],
    ['no reading at time 0', readings.slice(1), 'body.inputs.readings.0.time', /time 0/],
  ])('refuses %s with a 400 naming row and column, storing nothing', async (_what, rows, field, message) => {
    const before = await snapshotTables(t.db.sequelize);
    // A good report with the bad rows put in: the browser's calc-core would have refused them.
    const res = await report({ ...body(), inputs: { readings: rows, faceArea: 0.005 } }).expect(400);
    const fields = detailsOf(res.body).fields;
    expect(fields.map((f) => f.field)).toEqual([field]);
    expect(fields[0]?.message).toMatch(message);
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/);
    expect(await snapshotTables(t.db.sequelize)).toEqual(before);
  });

  it('refuses more than 200 rows in the contract, before any calculation', async () => {
    const many = Array.from({ length: 201 }, (_, i) => ({ time: i, mass: 1 }));
    const res = await report({ ...body(), inputs: { readings: many, faceArea: 0.005 } }).expect(400);
    expect(detailsOf(res.body).fields.map((f) => f.field)).toEqual(['body.inputs.readings']);
  });

  it('lets a firm give starting readings but never lock or hide them', async () => {
    const current = widgetSchema.parse(
      (await owner.get(`/orgs/${org.id}/widgets/${widget.id}`).expect(200)).body,
    );
    const starting = structuredClone(current.settings);
    starting.inputs = { ...starting.inputs, readings: { mode: 'editable', default: readings } };
    await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { settings: starting }).expect(200);
    const locked = structuredClone(current.settings);
    locked.inputs = { ...locked.inputs, readings: { mode: 'locked', default: readings } };
    const res = await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { settings: locked }).expect(400);
    expect(detailsOf(res.body).fields.map((f) => f.field)).toEqual(['body.settings.inputs.readings.mode']);
    const badStart = structuredClone(current.settings);
    badStart.inputs = { ...badStart.inputs, readings: { mode: 'editable', default: readings.slice(0, 2) } };
    const bad = await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { settings: badStart }).expect(400);
    expect(detailsOf(bad.body).fields.map((f) => f.field)).toEqual(['body.settings.inputs.readings.default']);
  });
});
