import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { calculate, getCalculator } from '@wickstone/calc-core';
import { errorBodySchema, verifyResponseSchema } from '@wickstone/contracts';
import {
  createTestApp,
  mailbox,
  seedOrgWithTeam,
  TestClient,
  uniqueEmail,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { Run } from '../db/models/index.js';
import { shown } from '../embed/format.js';
import { binary, pdfText } from '../../testing/pdf.js';
import { fieldsOf, liveWidget, reportRun, SITE, type FixtureWidget } from '../../testing/usage.js';

const collapse = (s: string) => s.replace(/\s+/g, ' ');

describe('calculation sheets and verification', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let owner: TestClient;
  let widget: FixtureWidget;

  beforeAll(async () => {
    t = await createTestApp({ SHEET_LIMIT_PER_IP: '25' });
    org = await seedOrgWithTeam();
    owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    widget = await liveWidget(owner, org.id, 'Wall rise check', 'tube-rise', [SITE], (settings) => ({
      ...settings,
      cautions: 'Call the office before relying on this for a damp-proofing specification.',
    }));
  });
  afterAll(async () => {
    await t.close();
  });

  async function storedRun(inputs: Record<string, number | string> = { diameter: 0.0008 }) {
    return { id: await reportRun(t.app, widget, inputs), r: calculate('tube-rise', inputs) };
  }

  const visitorSheet = (runId: string, query: Record<string, string> = {}, origin = SITE) =>
    request(t.app)
      .get(`/api/v1/embed/runs/${runId}/sheet`)
      .query({ publicKey: widget.publicKey, ...query })
      .set('Origin', origin)
      .buffer(true)
      .parse(binary);

  it('gives the visitor a PDF that prints the result, every source, the engine, the hash, the cautions and the verify link', async () => {
    const { id, r } = await storedRun();
    const res = await visitorSheet(id, {
      project: 'Quarry Row terrace',
      preparedFor: 'Lowfield Parish Trust',
    }).expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['access-control-allow-origin']).toBe(SITE);
    const text = pdfText(res.body as Buffer);
    // The result value as the one formatting rule (shared with the widget) prints it.
    const calc = getCalculator('tube-rise')!;
    const riseOut = calc.outputs.find((o) => o.id === 'rise')!;
    expect(text).toContain(`Rise`);
    expect(text).toContain(shown(r.outputs.rise as number, riseOut, 'si'));
    expect(shown(r.outputs.rise as number, riseOut, 'si')).toMatch(/^\d+(\.\d+)? mm$/);
    for (const step of r.working) expect(text).toContain(collapse(step.source as string));
    expect(text).toContain(`calc-core ${r.version}`);
    expect(text).toContain(r.inputHash);
    for (const c of r.cautions) expect(text).toContain(collapse(c.text).slice(0, 60));
    expect(text).toContain('Call the office before relying on this');
    expect(text).toContain('do not replace a site investigation');
    expect(text).toContain(`/verify/${id}`);
    expect(text).toContain('Quarry Row terrace');
    expect(text).toContain('Lowfield Parish Trust');
    expect(text).toContain('Prepared by');
    expect(text).toContain('Approved by');
    for (const ref of getCalculator('tube-rise')!.references)
      expect(text).toContain(collapse(ref.citation).slice(0, 40));
  });

  it('names a withheld output "not defined here" with its reason and prints no figure for it', async () => {
    // A bore as wide as a bucket: the rise laws need r ≪ ℓc, so the engine withholds their outputs.
    const inputs = { diameter: 0.05 };
    const r = calculate('tube-rise', inputs);
    const withheld = r.warnings.filter((w) => (w.withholds ?? []).length);
    expect(withheld.length).toBeGreaterThan(0);
    const { id } = await storedRun(inputs);
    const text = pdfText((await visitorSheet(id).expect(200)).body as Buffer);
    expect(text).toContain('not defined here');
    for (const w of withheld) expect(text).toContain(collapse(w.message).slice(0, 50));
  });

  it('refuses over-long or control-character project fields, naming the field', async () => {
    const { id } = await storedRun();
    const long = await visitorSheet(id, { project: 'x'.repeat(121) }).expect(400);
    expect(fieldsOf(long.body)).toEqual(['query.project']);
    const ctl = await visitorSheet(id, { note: 'line one\nforged line' }).expect(400);
    expect(fieldsOf(ctl.body)).toEqual(['query.note']);
    const extra = await visitorSheet(id, { colour: 'red' }).expect(400);
    expect(errorBodySchema.parse(extra.body).error.code).toBe('validation_failed');
    const badId = await visitorSheet('not-a-uuid').expect(400);
    expect(fieldsOf(badId.body)).toEqual(['params.runId']);
  });

  it("answers unknown runs, another widget's key and paused widgets with the same 404", async () => {
    const { id } = await storedRun();
    const unknown = await visitorSheet(randomUUID()).expect(404);
    expect(errorBodySchema.parse(unknown.body).error.code).toBe('not_found');
    await visitorSheet(id, {}, 'https://elsewhere.example').expect(403);
    const analyst = await owner.agent
      .get(`/api/v1/orgs/${org.id}/runs/${id}/sheet`)
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(pdfText(analyst.body as Buffer)).toContain(id);
    await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { status: 'paused' }).expect(200);
    try {
      const paused = await visitorSheet(id).expect(404);
      expect(errorBodySchema.parse(paused.body).error.message).toBe(
        errorBodySchema.parse(unknown.body).error.message,
      );
    } finally {
      await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { status: 'live' }).expect(200);
    }
  });

  /** Runs `body` with the widget's sheets turned off, and turns them back on whatever happens. */
  async function withSheetsOff(body: () => Promise<void>): Promise<void> {
    const settings = { ...widget.settings, sheet: { enabled: false, paper: 'letter' as const } };
    await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { settings }).expect(200);
    try {
      await body();
    } finally {
      await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { settings: widget.settings }).expect(200);
    }
  }

  it('stops visitor sheets when the firm turns them off', async () => {
    const { id } = await storedRun();
    await withSheetsOff(async () => {
      await visitorSheet(id).expect(403);
    });
  });

  it('verifies a stored run: agrees, with its hash and outputs, and no personal data', async () => {
    const { id, r } = await storedRun();
    const res = await request(t.app).get(`/api/v1/verify/${id}`).expect(200);
    const v = verifyResponseSchema.parse(res.body);
    expect(v.agrees).toBe(true);
    expect(v.inputHash).toEqual({ stored: r.inputHash, recomputed: r.inputHash });
    expect(v.outputs.every((o) => o.agrees)).toBe(true);
    expect(Object.keys(res.body as object).sort()).toEqual(
      [
        'agrees',
        'calculator',
        'createdAt',
        'engineVersion',
        'inputHash',
        'inputs',
        'outputs',
        'runId',
      ].sort(),
    );
    expect(JSON.stringify(res.body)).not.toContain(SITE);
  });

  it('says disagrees when a stored output was tampered with', async () => {
    const { id } = await storedRun();
    const run = await Run.findByPk(id);
    const stored = structuredClone(run!.serverResult!) as { outputs: Record<string, number | null> };
    stored.outputs.rise = (stored.outputs.rise as number) * 1.01;
    await Run.update({ serverResult: stored }, { where: { id } });
    const v = verifyResponseSchema.parse((await request(t.app).get(`/api/v1/verify/${id}`).expect(200)).body);
    expect(v.agrees).toBe(false);
    expect(v.outputs.find((o) => o.id === 'rise')?.agrees).toBe(false);
  });

  it('answers an unknown or erased run with 404 and says it may have been erased', async () => {
    const { id } = await storedRun();
    await Run.destroy({ where: { id } });
    const res = await request(t.app).get(`/api/v1/verify/${id}`).expect(404);
    expect(errorBodySchema.parse(res.body).error.message).toMatch(/erased/);
    await request(t.app).get('/api/v1/verify/nope').expect(400);
  });

  it('attaches the sheet to the copy e-mailed to the visitor', async () => {
    const { id, r } = await storedRun();
    const email = uniqueEmail('visitor');
    await request(t.app)
      .post('/api/v1/embed/leads')
      .set('Origin', SITE)
      .send({
        runId: id,
        publicKey: widget.publicKey,
        fields: { name: 'Ines Marlow', email },
        consent: true,
        sendCopy: true,
      })
      .expect(201);
    const [copy] = await mailbox(t.db.config.mail.fakeApiUrl, email);
    const pdf = copy?.attachments?.find((a) => a.contentType === 'application/pdf');
    expect(pdf?.filename).toBe(`calculation-sheet-${id}.pdf`);
    const text = pdfText(Buffer.from(pdf!.contentBase64, 'base64'));
    expect(text).toContain(r.inputHash);
    expect(text).toContain(`/verify/${id}`);
  });

  const widgetSheet = (runId: string, body: Record<string, string>, origin = SITE) =>
    request(t.app)
      .post(`/api/v1/embed/runs/${runId}/sheet`)
      .set('Origin', origin)
      .set('Content-Type', 'text/plain;charset=UTF-8')
      .send(JSON.stringify({ publicKey: widget.publicKey, ...body }))
      .buffer(true)
      .parse(binary);

  it("keeps the project block typed in the widget with the run: the visitor's, the analyst's and the e-mailed copies print it; erasing the enquiry takes it", async () => {
    const { id } = await storedRun();
    const block = {
      project: 'Mill Lane cottages, gable wall',
      preparedFor: 'Hesketh Lettings',
      note: 'Ground floor only',
    };
    const first = await widgetSheet(id, block).expect(200);
    expect(first.headers['content-type']).toBe('application/pdf');
    expect(pdfText(first.body as Buffer)).toContain('Mill Lane cottages, gable wall');
    expect((await Run.findByPk(id))!.sheetProject).toEqual(block);
    // A later copy that types nothing prints the stored block; one that types a block prints that one.
    const again = pdfText((await visitorSheet(id).expect(200)).body as Buffer);
    for (const v of Object.values(block)) expect(again).toContain(v);
    const other = pdfText((await visitorSheet(id, { project: 'Elsewhere' }).expect(200)).body as Buffer);
    expect(other).toContain('Elsewhere');
    expect(other).not.toContain('Mill Lane');
    const analyst = await owner.agent
      .get(`/api/v1/orgs/${org.id}/runs/${id}/sheet`)
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(pdfText(analyst.body as Buffer)).toContain('Hesketh Lettings');
    const email = uniqueEmail('visitor');
    const lead = await request(t.app)
      .post('/api/v1/embed/leads')
      .set('Origin', SITE)
      .send({
        runId: id,
        publicKey: widget.publicKey,
        fields: { name: 'Ines Marlow', email },
        consent: true,
        sendCopy: true,
      })
      .expect(201);
    const [copy] = await mailbox(t.db.config.mail.fakeApiUrl, email);
    const attached = copy?.attachments?.find((a) => a.contentType === 'application/pdf');
    expect(pdfText(Buffer.from(attached!.contentBase64, 'base64'))).toContain('Mill Lane cottages');
    // "Prepared for" may name a person: erasing the enquiry's personal data takes the block too.
    await owner.delete(`/orgs/${org.id}/leads/${(lead.body as { id: number }).id}/personal-data`).expect(200);
    expect((await Run.findByPk(id))!.sheetProject).toBeNull();
  });

  it('refuses a bad project block from the widget naming the field, and stores nothing', async () => {
    const { id } = await storedRun();
    const long = await widgetSheet(id, { preparedFor: 'y'.repeat(121) }).expect(400);
    expect(fieldsOf(long.body)).toEqual(['body.preparedFor']);
    const ctl = await widgetSheet(id, { project: 'a\u0007b' }).expect(400);
    expect(fieldsOf(ctl.body)).toEqual(['body.project']);
    expect((await Run.findByPk(id))!.sheetProject).toBeNull();
    // Nothing typed: a sheet, and no empty block stored.
    await widgetSheet(id, { project: '  ' }).expect(200);
    expect((await Run.findByPk(id))!.sheetProject).toBeNull();
  });

  it('prints the statement that results are estimates once', async () => {
    const { id } = await storedRun();
    const text = pdfText((await visitorSheet(id).expect(200)).body as Buffer);
    expect(text.match(/do not replace a site investigation/g)).toHaveLength(1);
  });

  it('tells the widget whether it offers sheets, and a widget without them answers every run id alike', async () => {
    const settingsOf = async () =>
      (
        (
          await request(t.app)
            .get(`/api/v1/embed/widgets/${widget.publicKey}`)
            .set('Origin', SITE)
            .expect(200)
        ).body as { settings: { sheet: { enabled: boolean } } }
      ).settings.sheet;
    expect(await settingsOf()).toEqual({ enabled: true });
    const { id } = await storedRun();
    await withSheetsOff(async () => {
      expect(await settingsOf()).toEqual({ enabled: false });
      const known = await widgetSheet(id, {}).expect(403);
      const unknown = await widgetSheet(randomUUID(), {}).expect(403);
      expect(unknown.body).toEqual(known.body);
    });
  });

  it('rate-limits sheet requests per address', async () => {
    const { id } = await storedRun();
    let last = 200;
    for (let i = 0; i < 30 && last !== 429; i++) last = (await visitorSheet(id)).status;
    expect(last).toBe(429);
  });
});
