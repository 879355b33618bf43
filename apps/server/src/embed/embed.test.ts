import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { calculate, getCalculator } from '@wickstone/calc-core';
import { headline } from '@wickstone/calc-core/answer';
import { embedWidgetSchema, errorBodySchema, widgetSchema, type Widget } from '@wickstone/contracts';
import {
  createTestApp,
  mailbox,
  runReportBody,
  seedOrgWithTeam,
  TestClient,
  uniqueEmail,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { Lead, Run } from '../db/models/index.js';
import { rollupsFromRaw, storedRollups } from '../usage/rollups.js';

const SITE = 'https://www.brackenridge-ground.example';
const fieldsOf = (body: unknown) =>
  (errorBodySchema.parse(body).error.details as { fields: { field: string }[] }).fields.map((f) => f.field);

describe('public embed API', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let owner: TestClient;
  let widget: Widget;
  let notify: string;

  beforeAll(async () => {
    t = await createTestApp();
    org = await seedOrgWithTeam();
    owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    notify = uniqueEmail('firm');
    const created = widgetSchema.parse(
      (
        await owner
          .post(`/orgs/${org.id}/widgets`, {
            name: 'Tube rise',
            calculatorId: 'tube-rise',
            allowedOrigins: [SITE],
          })
          .expect(201)
      ).body,
    );
    const settings = structuredClone(created.settings);
    settings.inputs = { gravity: { mode: 'locked', default: 9.80665 } };
    settings.leadForm.notify = [notify];
    settings.leadForm.fields.phone = 'off';
    widget = widgetSchema.parse(
      (await owner.patch(`/orgs/${org.id}/widgets/${created.id}`, { status: 'live', settings }).expect(200))
        .body,
    );
  });
  afterAll(() => t.close());

  const embed = () => request(t.app);
  const report = (body: unknown, origin = SITE) =>
    embed()
      .post('/api/v1/embed/runs')
      .set('Origin', origin)
      .set('Content-Type', 'text/plain;charset=UTF-8')
      .send(JSON.stringify(body));

  const runBody = (inputs: Record<string, number | string> = { diameter: 0.0008 }) =>
    runReportBody(widget.publicKey, { id: randomUUID(), inputs, pageUrl: `${SITE}/services/rising-damp` });

  describe('settings', () => {
    it('answers an allowed origin with what the widget needs and nothing private', async () => {
      const res = await embed()
        .get(`/api/v1/embed/widgets/${widget.publicKey}`)
        .set('Origin', SITE)
        .expect(200);
      expect(res.headers['access-control-allow-origin']).toBe(SITE);
      const body = embedWidgetSchema.parse(res.body);
      expect(body.calculatorId).toBe('tube-rise');
      // How the result is shown goes with it: secondary outputs folded unless the firm hides them.
      expect(body.settings.result).toEqual({ secondary: 'folded' });
      expect(JSON.stringify(res.body)).not.toContain(notify);
      expect(JSON.stringify(res.body)).not.toContain('allowedOrigins');
    });

    it('sends the settings compressed, with a validator that answers an unchanged widget with 304', async () => {
      const first = await embed()
        .get(`/api/v1/embed/widgets/${widget.publicKey}`)
        .set('Origin', SITE)
        .set('Accept-Encoding', 'gzip')
        .expect(200);
      expect(first.headers['content-encoding']).toBe('gzip');
      expect(first.headers['cache-control']).toBe('private, no-cache');
      expect(first.headers.vary).toMatch(/Origin/);
      expect(first.headers.vary).toMatch(/Accept-Encoding/);
      const etag = first.headers.etag;
      expect(etag).toMatch(/^W\/"/);
      const again = await embed()
        .get(`/api/v1/embed/widgets/${widget.publicKey}`)
        .set('Origin', SITE)
        .set('If-None-Match', etag as string)
        .expect(304);
      expect(again.text ?? '').toBe('');
      // A changed widget no longer matches.
      await owner
        .patch(`/orgs/${org.id}/widgets/${widget.id}`, { name: 'Renamed for the validator' })
        .expect(200);
      await embed()
        .get(`/api/v1/embed/widgets/${widget.publicKey}`)
        .set('Origin', SITE)
        .set('If-None-Match', etag as string)
        .expect(200);
      await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { name: widget.name }).expect(200);
    });

    it('gives an origin that is not allowed no widget and no settings', async () => {
      const res = await embed()
        .get(`/api/v1/embed/widgets/${widget.publicKey}`)
        .set('Origin', 'https://copycat.example')
        .expect(403);
      // readable, so the widget knows at once, but it carries no settings
      expect(res.headers['access-control-allow-origin']).toBe('https://copycat.example');
      expect(Object.keys(res.body)).toEqual(['error']);
      expect(JSON.stringify(res.body)).not.toContain('tube-rise');
      await embed().get(`/api/v1/embed/widgets/${widget.publicKey}`).expect(403);
    });

    it('answers 404 for a draft or unknown key', async () => {
      const draft = widgetSchema.parse(
        (
          await owner
            .post(`/orgs/${org.id}/widgets`, {
              name: 'Draft',
              calculatorId: 'slot-rise',
              allowedOrigins: [SITE],
            })
            .expect(201)
        ).body,
      );
      await embed().get(`/api/v1/embed/widgets/${draft.publicKey}`).set('Origin', SITE).expect(404);
      await embed().get('/api/v1/embed/widgets/wk_aaaaaaaaaaaaaaaaaaaa').set('Origin', SITE).expect(404);
      const bad = await embed().get('/api/v1/embed/widgets/not-a-key').set('Origin', SITE).expect(400);
      expect(fieldsOf(bad.body)).toEqual(['params.publicKey']);
    });

    it('answers a preflight only for known origins', async () => {
      const ok = await embed()
        .options('/api/v1/embed/runs')
        .set('Origin', SITE)
        .set('Access-Control-Request-Method', 'POST')
        .expect(204);
      expect(ok.headers['access-control-allow-origin']).toBe(SITE);
      const no = await embed()
        .options('/api/v1/embed/runs')
        .set('Origin', 'https://copycat.example')
        .expect(204);
      expect(no.headers['access-control-allow-origin']).toBeUndefined();
    });
  });

  describe('runs', () => {
    it('stores a run once, recomputed by the server, and a retry of the same report is one row', async () => {
      const body = runBody();
      const first = await report(body).expect(201);
      expect(first.body).toEqual({ id: body.id, agreed: true, duplicate: false });
      const again = await report(body).expect(200);
      expect(again.body).toEqual({ id: body.id, agreed: true, duplicate: true });
      expect(await Run.count({ where: { id: body.id } })).toBe(1);
      const row = await Run.findByPk(body.id);
      expect(row).toMatchObject({
        origin: SITE,
        calculatorId: 'tube-rise',
        agreed: true,
        hasWarning: false,
        organizationId: org.id,
      });
    });

    it('refuses the same run id with a different body and keeps the first', async () => {
      const body = runBody();
      await report(body).expect(201);
      const changed = { ...body, inputs: { ...body.inputs, diameter: 0.002 } };
      const res = await report(changed).expect(409);
      expect(fieldsOf(res.body)).toEqual(['body.id']);
      expect((await Run.findByPk(body.id))?.inputs.diameter).toBe(0.0008);
    });

    it('stores reports arriving together in one batch: each once, a repeat as a duplicate, a changed repeat refused, rollups equal to the rows', async () => {
      const stored = runBody();
      await report(stored).expect(201);
      const fresh = Array.from({ length: 40 }, (_, i) => runBody({ diameter: 0.0002 + i * 0.00005 }));
      const twin = runBody();
      const changedTwin = { ...twin, inputs: { ...twin.inputs, diameter: 0.003 } };
      const changedStored = { ...stored, inputs: { ...stored.inputs, diameter: 0.004 } };
      // Sent at once, so they queue behind one another and share batches.
      const answers = await Promise.all(
        [...fresh, twin, twin, changedTwin, stored, changedStored].map((b) => report(b)),
      );
      const statuses = answers.map((a) => a.status);
      expect(statuses.slice(0, 40)).toEqual(Array(40).fill(201));
      // The twin: one stored (201), its exact repeat a duplicate (200); the changed one refused.
      expect(statuses.slice(40, 43).sort()).toEqual([200, 201, 409]);
      expect(answers[42]!.status).toBe(409);
      expect(answers[43]!.status).toBe(200);
      expect(answers[43]!.body).toEqual({ id: stored.id, agreed: true, duplicate: true });
      expect(answers[44]!.status).toBe(409);
      const ids = [...fresh, twin, stored].map((b) => b.id);
      expect(await Run.count({ where: { id: ids } })).toBe(ids.length);
      expect((await Run.findByPk(twin.id))?.inputs.diameter).toBe(twin.inputs.diameter);
      expect(await storedRollups(t.db.sequelize)).toEqual(await rollupsFromRaw(t.db.sequelize));
    });

    it('refuses reports as soon as the widget is paused, and takes them again when it is live', async () => {
      await report(runBody()).expect(201);
      await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { status: 'paused' }).expect(200);
      const paused = runBody();
      await report(paused).expect(404);
      await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { status: 'live' }).expect(200);
      await report(paused).expect(201);
    });

    it('flags a report whose numbers the server does not reproduce', async () => {
      const body = runBody();
      body.result.outputs = { ...body.result.outputs, rise: 1.5 };
      expect((await report(body).expect(201)).body.agreed).toBe(false);
      const row = await Run.findByPk(body.id);
      expect(row?.agreed).toBe(false);
      expect(row?.mismatch).toMatchObject({ outputs: { rise: { client: 1.5 } } });
    });

    it('records the warning codes the server finds', async () => {
      const body = runBody({ diameter: 0.004 });
      await report(body).expect(201);
      const row = await Run.findByPk(body.id);
      expect(row?.hasWarning).toBe(true);
      expect(row?.warningCodes).toContain('BORE_NOT_SMALL');
    });

    it('refuses bad inputs, a changed locked input and a foreign origin, storing nothing', async () => {
      const before = await Run.count();
      const bad = runBody();
      bad.inputs = { ...bad.inputs, diameter: -1 };
      expect(fieldsOf((await report(bad).expect(400)).body)).toEqual(['body.inputs.diameter']);
      const locked = runBody();
      locked.inputs = { ...locked.inputs, gravity: 3.71 };
      expect(fieldsOf((await report(locked).expect(400)).body)).toEqual(['body.inputs.gravity']);
      await report(runBody(), 'https://copycat.example').expect(403);
      const malformed = await embed()
        .post('/api/v1/embed/runs')
        .set('Origin', SITE)
        .set('Content-Type', 'text/plain')
        .send('{"id":');
      expect(malformed.status).toBe(400);
      const missing = await report({ publicKey: widget.publicKey }).expect(400);
      expect(fieldsOf(missing.body)).toEqual(
        expect.arrayContaining(['body.id', 'body.inputs', 'body.result', 'body.unitSystem']),
      );
      const extra = await report({ ...runBody(), cookie: 'x' }).expect(400);
      expect(fieldsOf(extra.body)).toEqual(['body.cookie']);
      const huge = await report({ ...runBody(), pageUrl: `${SITE}/${'x'.repeat(40_000)}` });
      expect(huge.status).toBe(413);
      expect(await Run.count()).toBe(before);
    });
  });

  describe('leads', () => {
    const sendLead = (body: unknown, origin = SITE) =>
      embed()
        .post('/api/v1/embed/leads')
        .set('Origin', origin)
        .set('Content-Type', 'text/plain')
        .send(JSON.stringify(body));

    it('stores a lead with its run and e-mails the firm and the visitor', async () => {
      const run = runBody();
      await report(run).expect(201);
      const visitor = uniqueEmail('visitor');
      const res = await sendLead({
        runId: run.id,
        publicKey: widget.publicKey,
        fields: {
          name: 'Hester Quayle',
          email: visitor,
          siteAddress: '4 Mill Lane, Ashby Parva',
          message: 'Damp at skirting level.',
        },
        consent: true,
        sendCopy: true,
      }).expect(201);
      const lead = await Lead.findByPk(res.body.id as number);
      expect(lead).toMatchObject({
        runId: run.id,
        organizationId: org.id,
        email: visitor,
        status: 'new',
        origin: SITE,
      });
      const [firmMail] = await mailbox(t.db.config.mail.fakeApiUrl, notify);
      expect(firmMail?.subject).toContain('Hester Quayle');
      expect(firmMail?.links.some((l) => l.endsWith(`/orgs/${org.id}/leads/${lead?.id}`))).toBe(true);
      // The firm reads the answer the visitor read: the widget's headline, in the visitor's units.
      const read = headline(getCalculator('tube-rise')!, calculate('tube-rise', run.inputs), 'si').text;
      expect(firmMail?.text).toContain(`The visitor read: ${read}`);
      expect(firmMail?.html).toContain('What the visitor read');
      const [copy] = await mailbox(t.db.config.mail.fakeApiUrl, visitor);
      expect(copy?.subject).toContain('Tube rise');
      expect(copy?.text).toMatch(/Rise/i);
      expect(copy?.text).toContain('licensed professional');
      // one request per result
      const twice = await sendLead({
        runId: run.id,
        publicKey: widget.publicKey,
        fields: { name: 'H', email: visitor },
        consent: true,
      }).expect(409);
      expect(fieldsOf(twice.body)).toEqual(['body.runId']);
    });

    it("mails in the firm's name and colours with Reply-To both ways, the estimate statement once and no input the firm hid", async () => {
      const settings = structuredClone(widget.settings);
      settings.inputs = { gravity: { mode: 'hidden', default: 9.80665 } };
      settings.look.colors.primary = '#7a3b12';
      await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { settings }).expect(200);
      try {
        const run = runBody();
        await report(run).expect(201);
        const visitor = uniqueEmail('visitor');
        await sendLead({
          runId: run.id,
          publicKey: widget.publicKey,
          fields: { name: 'Tamsin Rowe', email: visitor },
          consent: true,
          sendCopy: true,
        }).expect(201);
        const [firmMail] = await mailbox(t.db.config.mail.fakeApiUrl, notify, 2);
        expect(firmMail?.subject).toContain('Tamsin Rowe');
        expect(firmMail?.from).toContain(`${org.name} via Wickstone`);
        expect(firmMail?.replyTo).toContain(visitor);
        const [copy] = await mailbox(t.db.config.mail.fakeApiUrl, visitor);
        expect(copy?.from).toContain(`${org.name} via Wickstone`);
        expect(copy?.replyTo).toContain(notify);
        // A real HTML part in the firm's colour beside the plain-text one.
        expect(copy?.html).toContain('#7a3b12');
        expect(copy?.html).toMatch(/<table role="presentation"/);
        expect(copy?.text).toMatch(/Rise/);
        expect(copy?.text.match(/licensed professional/g)).toHaveLength(1);
        expect(copy?.html?.match(/licensed professional/g)).toHaveLength(1);
        const gravity = getCalculator('tube-rise')!.inputs.find((i) => i.id === 'gravity')!;
        expect(copy?.text).not.toContain(`  ${gravity.label}: `);
        // Warning codes are the firm's vocabulary, not the visitor's.
        expect(copy?.text).not.toMatch(/\[[A-Z_]+\]/);
      } finally {
        await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { settings: widget.settings }).expect(200);
      }
    });

    it('needs consent and the required fields, and refuses fields the form does not ask for', async () => {
      const run = runBody();
      await report(run).expect(201);
      const noConsent = await sendLead({
        runId: run.id,
        publicKey: widget.publicKey,
        fields: { name: 'A', email: uniqueEmail() },
        consent: false,
      }).expect(400);
      expect(fieldsOf(noConsent.body)).toEqual(['body.consent']);
      const missing = await sendLead({
        runId: run.id,
        publicKey: widget.publicKey,
        fields: { name: 'A' },
        consent: true,
      }).expect(400);
      expect(fieldsOf(missing.body)).toEqual(['body.fields.email']);
      const off = await sendLead({
        runId: run.id,
        publicKey: widget.publicKey,
        fields: { name: 'A', email: uniqueEmail(), phone: '01234 567890' },
        consent: true,
      }).expect(400);
      expect(fieldsOf(off.body)).toEqual(['body.fields.phone']);
      const unknownRun = await sendLead({
        runId: randomUUID(),
        publicKey: widget.publicKey,
        fields: { name: 'A', email: uniqueEmail() },
        consent: true,
      }).expect(400);
      expect(fieldsOf(unknownRun.body)).toEqual(['body.runId']);
      expect(await Lead.count({ where: { runId: run.id } })).toBe(0);
    });
    // Lead and copy limits: limits.test.ts.
  });
});
