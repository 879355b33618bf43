import { randomUUID } from 'node:crypto';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import type { calculate as calculateFn, CalculationResult } from '@wickstone/calc-core';
import { runDetailSchema } from '@wickstone/contracts';
import {
  createTestApp,
  mailbox,
  seedOrgWithTeam,
  TestClient,
  uniqueEmail,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { binary, pdfText } from '../../testing/pdf.js';
import {
  liveWidget,
  requestAssessment,
  runAt,
  SITE,
  store,
  type FixtureWidget,
} from '../../testing/usage.js';
import { reportOf } from './invent.js';
import { stripWorking } from '../db/migrations/20261202190100-runs-without-working.js';

// The published 0.1.0 release's own engine (engine version 0.1.0, while this server's calc-core is
// newer): a run it made must be shown with its working, not this server's.
const engine010 = createRequire(import.meta.url)(
  fileURLToPath(new URL('../../../../releases/0.1.0/engine.mjs', import.meta.url)),
) as { calculate: typeof calculateFn; VERSION: string };

const collapse = (s: string) => s.replace(/\s+/g, ' ');
/** The result as JSON carries it (what the API answers and the database keeps). */
const asJson = (r: unknown) => JSON.parse(JSON.stringify(r)) as Record<string, unknown>;

describe('runs keep their figures, not their working, which is made again where it is shown', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let owner: TestClient;
  let widget: FixtureWidget;

  beforeAll(async () => {
    t = await createTestApp();
    org = await seedOrgWithTeam();
    owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    widget = await liveWidget(owner, org.id, 'Pore rise check', 'tube-rise', [SITE]);
  });
  afterAll(async () => {
    await t.close();
  });

  const storedResult = async (id: string) =>
    (
      await t.db.sequelize.query<{ server_result: Record<string, unknown> | string }>(
        'SELECT server_result FROM runs WHERE id = ?',
        { replacements: [id], type: QueryTypes.SELECT },
      )
    ).map((r) =>
      typeof r.server_result === 'string'
        ? (JSON.parse(r.server_result) as Record<string, unknown>)
        : r.server_result,
    )[0]!;

  /** A report from a page running release 0.1.0, made with that release's engine. */
  async function report010(inputs: Record<string, number>): Promise<{ id: string; r: CalculationResult }> {
    const r = engine010.calculate('tube-rise', inputs);
    const body = {
      ...reportOf(r, { id: randomUUID(), publicKey: widget.publicKey, unitSystem: 'si' }),
      release: '0.1.0',
    };
    const res = await request(t.app).post('/api/v1/embed/runs').set('Origin', SITE).send(body).expect(201);
    expect(res.body).toMatchObject({ agreed: true });
    return { id: body.id, r };
  }

  const detail = async (id: string) =>
    runDetailSchema.parse((await owner.get(`/orgs/${org.id}/runs/${id}`).expect(200)).body);
  const analystSheet = async (id: string) =>
    pdfText(
      (
        await owner.agent
          .get(`/api/v1/orgs/${org.id}/runs/${id}/sheet`)
          .buffer(true)
          .parse(binary)
          .expect(200)
      ).body as Buffer,
    );

  it('stores a reported run with its figures, warnings, band, version and hash, without the working', async () => {
    const { id, r } = await report010({ diameter: 0.0004, temperatureC: 12 });
    const stored = await storedResult(id);
    expect(Object.keys(stored).sort()).toEqual(
      ['band', 'calculator', 'inputHash', 'outputs', 'version', 'warnings'].sort(),
    );
    expect(stored).toEqual(
      asJson({
        calculator: r.calculator,
        outputs: r.outputs,
        warnings: r.warnings,
        band: r.band,
        version: '0.1.0',
        inputHash: r.inputHash,
      }),
    );
    expect(r.version).toBe(engine010.VERSION);
  });

  it("shows a new run's working on its page, made again with the engine of the run's release", async () => {
    const { id, r } = await report010({ diameter: 0.0006 });
    const d = await detail(id);
    expect(r.working.length).toBeGreaterThan(0);
    // Exactly the result the 0.1.0 engine gave the visitor: its version, working, assumptions, cautions.
    expect(d.serverResult).toEqual(asJson(r));
    expect(d.serverResult?.version).toBe('0.1.0');
  });

  it("prints a new run's working on its calculation sheet and in the e-mailed copy", async () => {
    const { id, r } = await report010({ diameter: 0.0009 });
    const sheet = await analystSheet(id);
    for (const step of r.working) {
      expect(sheet).toContain(collapse(step.label));
      expect(sheet).toContain(collapse(`Source: ${step.source ?? 'none given'}`));
    }
    const email = uniqueEmail('visitor');
    await requestAssessment(t.app, widget, id, { name: 'Orla Penhale', email }, SITE, true);
    const [copy] = await mailbox(t.db.config.mail.fakeApiUrl, email);
    expect(copy?.text).toContain('Working');
    for (const step of r.working) expect(collapse(copy!.text)).toContain(collapse(step.label));
    // The cautions are not stored either: the copy has them from the engine.
    for (const c of r.cautions) expect(collapse(copy!.text)).toContain(collapse(c.text).slice(0, 60));
    const pdf = copy?.attachments?.find((a) => a.contentType === 'application/pdf');
    const attached = pdfText(Buffer.from(pdf!.contentBase64, 'base64'));
    for (const step of r.working)
      expect(attached).toContain(collapse(`Source: ${step.source ?? 'none given'}`));
  });

  it('shows an older run that stored its working as stored, on its page and its sheet', async () => {
    const row = runAt(widget, new Date().toISOString(), { diameter: 0.0005 });
    // As rows were stored before: the whole result, here with a step only the stored copy has.
    const whole = asJson(engine010.calculate('tube-rise', { diameter: 0.0005 }));
    const working = [...(whole.working as Record<string, unknown>[])];
    working[0] = { ...working[0], label: 'Step as stored with the old row' };
    row.serverResult = { ...whole, working };
    row.release = '0.1.0';
    await store(t.db.sequelize, [row]);
    const d = await detail(row.id);
    expect(d.serverResult).toEqual({ ...whole, working });
    expect(await analystSheet(row.id)).toContain('Step as stored with the old row');
  });

  it('the migration strips the working from older rows in bounded batches; their page then makes it again', async () => {
    const rows = [0.0002, 0.0003, 0.0004, 0.0005, 0.0007].map((diameter) => {
      const row = runAt(widget, new Date().toISOString(), { diameter });
      row.serverResult = asJson(engine010.calculate('tube-rise', { diameter }));
      row.release = '0.1.0';
      return row;
    });
    await store(t.db.sequelize, rows);
    for (const row of rows) expect((await storedResult(row.id)).working).toEqual(expect.any(Array));
    const before = new Map(
      await Promise.all(rows.map(async (r) => [r.id, await storedResult(r.id)] as const)),
    );

    // Batches of two: every row holding working is stripped, whatever batch it falls in.
    expect(await stripWorking(t.db.sequelize, 2)).toBeGreaterThanOrEqual(rows.length);
    for (const row of rows) {
      const now = await storedResult(row.id);
      const was = before.get(row.id)!;
      expect(now).toEqual({
        calculator: was.calculator,
        outputs: was.outputs,
        warnings: was.warnings,
        band: was.band,
        version: was.version,
        inputHash: was.inputHash,
      });
      expect((await detail(row.id)).serverResult).toEqual(was);
    }
    // Again: nothing left to strip.
    expect(await stripWorking(t.db.sequelize, 2)).toBe(0);
  });
});
