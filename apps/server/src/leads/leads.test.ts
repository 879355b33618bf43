import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { leadDetailSchema, leadListResponseSchema, leadSchema, runDetailSchema } from '@wickstone/contracts';
import {
  createTestApp,
  seedOrgWithTeam,
  TestClient,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { UTF8_BOM } from '../export/csv.js';
import { readCsv } from '../../testing/csv.js';
import {
  fieldsOf,
  liveWidget,
  reportRun,
  requestAssessment,
  type FixtureWidget,
} from '../../testing/usage.js';
import { rollupsFromRaw, storedRollups } from '../usage/rollups.js';

describe('leads', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let other: FixtureOrg;
  let analyst: TestClient;
  let developer: TestClient;
  let otherAnalyst: TestClient;
  let tube: FixtureWidget;
  let soil: FixtureWidget;
  const lead: Record<'hester' | 'formula' | 'priya' | 'fenwick', number> = {
    hester: 0,
    formula: 0,
    priya: 0,
    fenwick: 0,
  };
  const runOf: Record<string, string> = {};

  const list = async (query: string, client = analyst) =>
    leadListResponseSchema.parse((await client.get(`/orgs/${org.id}/leads?${query}`).expect(200)).body);
  const ids = async (query: string) => (await list(query)).items.map((l) => l.id);
  /** Every row of the other organisation's runs and leads, to show an action here changed none of them. */
  const otherRows = async () =>
    JSON.stringify([
      await t.db.sequelize.query('SELECT * FROM leads WHERE organization_id = ? ORDER BY id', {
        replacements: [other.id],
        type: QueryTypes.SELECT,
      }),
      await t.db.sequelize.query('SELECT * FROM runs WHERE organization_id = ? ORDER BY id', {
        replacements: [other.id],
        type: QueryTypes.SELECT,
      }),
      await t.db.sequelize.query('SELECT * FROM run_daily WHERE organization_id = ? ORDER BY day', {
        replacements: [other.id],
        type: QueryTypes.SELECT,
      }),
    ]);

  beforeAll(async () => {
    t = await createTestApp({ LEAD_LIMIT_PER_IP: '1000' });
    org = await seedOrgWithTeam('Brackenridge Ground & Damp');
    other = await seedOrgWithTeam('Fenwick Clay Testing');
    const owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    analyst = new TestClient(t.app);
    await analyst.login(org.users.analyst.email, org.users.analyst.password);
    developer = new TestClient(t.app);
    await developer.login(org.users.developer.email, org.users.developer.password);
    const otherOwner = new TestClient(t.app);
    await otherOwner.login(other.users.owner.email, other.users.owner.password);
    otherAnalyst = new TestClient(t.app);
    await otherAnalyst.login(other.users.analyst.email, other.users.analyst.password);
    const quiet = (s: Parameters<NonNullable<Parameters<typeof liveWidget>[5]>>[0]) => ({
      ...s,
      leadForm: { ...s.leadForm, notify: ['surveys@brackenridge-ground.example'] },
    });
    tube = await liveWidget(owner, org.id, 'Rising damp in a pore', 'tube-rise', undefined, quiet);
    soil = await liveWidget(owner, org.id, 'Slab check', 'soil-capillary-rise', undefined, quiet);
    const fenwick = await liveWidget(otherOwner, other.id, 'Fenwick tube', 'tube-rise', undefined, quiet);

    const ask = async (
      key: keyof typeof lead,
      w: FixtureWidget,
      inputs: Record<string, number>,
      fields: Record<string, string>,
    ) => {
      runOf[key] = await reportRun(t.app, w, inputs);
      lead[key] = await requestAssessment(t.app, w, runOf[key]!, fields);
    };
    await ask(
      'hester',
      tube,
      { diameter: 0.0008 },
      {
        name: 'Hester Quayle',
        email: 'hester.quayle@mail.example',
        company: 'Quayle Holdings',
        message: 'Damp along the north wall, up to 1.2 m.\r\nSecond line, with a "quote".',
        siteAddress: '4 Mill Lane, Ashby Parva',
      },
    );
    await ask(
      'formula',
      tube,
      { diameter: 0.004 },
      {
        name: '=HYPERLINK("http://evil.example","click")',
        email: 'owain.b@post.example',
        company: '+44 Builders',
      },
    );
    await ask(
      'priya',
      soil,
      { d10: 0.0001, waterTableDepth: 1 },
      { name: 'Priya Venn', email: 'priya.venn@homes.example', company: 'Venn & Co 50%' },
    );
    await ask(
      'fenwick',
      fenwick,
      { diameter: 0.0008 },
      { name: 'Caspar Doyle', email: 'c.doyle@builders.example' },
    );
    // Spread the received times over three days, so the date filters have something to tell apart.
    for (const [key, at] of [
      ['hester', '2026-11-01 09:00:00'],
      ['formula', '2026-11-02 09:00:00'],
      ['priya', '2026-11-03 23:59:59.999'],
    ] as const) {
      await t.db.sequelize.query('UPDATE leads SET created_at = ? WHERE id = ?', {
        replacements: [at, lead[key]],
        type: QueryTypes.UPDATE,
      });
    }
  });
  afterAll(() => t.close());

  describe('the list', () => {
    it("lists the organisation's leads newest first, none of another's", async () => {
      const r = await list('');
      expect(r.total).toBe(3);
      expect(r.items.map((l) => l.id)).toEqual([lead.priya, lead.formula, lead.hester]);
      expect(r.items[2]).toMatchObject({
        status: 'new',
        widget: { id: tube.id, name: 'Rising damp in a pore' },
        runId: runOf.hester,
        name: 'Hester Quayle',
        siteAddress: '4 Mill Lane, Ashby Parva',
        assignee: null,
        erasedAt: null,
      });
    });

    it('filters by widget, received days, and text in the name, e-mail address or company', async () => {
      expect(await ids(`widgetId=${soil.id}`)).toEqual([lead.priya]);
      expect(await ids('from=2026-11-02&to=2026-11-03')).toEqual([lead.priya, lead.formula]);
      expect(await ids('to=2026-11-01')).toEqual([lead.hester]);
      expect(await ids('q=QUAYLE')).toEqual([lead.hester]);
      expect(await ids('q=post.example')).toEqual([lead.formula]);
      expect(await ids(`q=${encodeURIComponent('venn & co')}`)).toEqual([lead.priya]);
      // % is a character searched for, not a wildcard.
      expect(await ids('q=%25')).toEqual([lead.priya]);
      expect(await ids('q=_')).toEqual([]);
      expect(await ids('q=Doyle')).toEqual([]);
    });

    it('pages with the right total, past the end too, and sorts oldest first on request', async () => {
      expect(await list('pageSize=2&page=2')).toMatchObject({ total: 3, items: [{ id: lead.hester }] });
      expect(await list('pageSize=2&page=5')).toEqual({ total: 3, items: [] });
      expect(await ids('sort=createdAt')).toEqual([lead.hester, lead.formula, lead.priya]);
      for (const [query, field] of [
        ['pageSize=201', 'query.pageSize'],
        ['status=won', 'query.status'],
        ['assigneeId=someone', 'query.assigneeId'],
        ['q=', 'query.q'],
        ['from=2026-11-03&to=2026-11-01', 'query.to'],
      ]) {
        expect(
          fieldsOf((await analyst.get(`/orgs/${org.id}/leads?${query}`).expect(400)).body),
          query,
        ).toEqual([field]);
      }
    });

    it('is for those who work leads: a developer may not read it', async () => {
      await developer.get(`/orgs/${org.id}/leads`).expect(403);
      await developer.get(`/orgs/${org.id}/leads/${lead.hester}`).expect(403);
      await developer.get(`/orgs/${org.id}/leads/export`).expect(403);
    });
  });

  describe('working a lead', () => {
    it('moves it on, assigns it to a member and keeps a dated list of notes with their authors', async () => {
      const before = leadSchema.parse(
        (await analyst.get(`/orgs/${org.id}/leads/${lead.formula}`).expect(200)).body,
      );
      await new Promise((r) => setTimeout(r, 5));
      const res = await analyst
        .patch(`/orgs/${org.id}/leads/${lead.formula}`, {
          status: 'contacted',
          assigneeId: org.users.analyst.id,
        })
        .expect(200);
      const after = leadSchema.parse(res.body);
      expect(after).toMatchObject({
        status: 'contacted',
        assignee: { id: org.users.analyst.id, email: org.users.analyst.email },
        notes: [],
      });
      for (const body of ['Called back; survey booked.', 'Survey moved to Friday.'])
        await analyst.post(`/orgs/${org.id}/leads/${lead.formula}/notes`, { body: `  ${body} ` }).expect(201);
      const noted = leadSchema.parse(
        (await analyst.get(`/orgs/${org.id}/leads/${lead.formula}`).expect(200)).body,
      );
      expect(noted.notes.map((n) => [n.body, n.author?.id])).toEqual([
        ['Called back; survey booked.', org.users.analyst.id],
        ['Survey moved to Friday.', org.users.analyst.id],
      ]);
      expect(noted.notes[0]!.createdAt <= noted.notes[1]!.createdAt).toBe(true);
      expect(after.updatedAt > before.updatedAt).toBe(true);
      expect(await ids('status=contacted')).toEqual([lead.formula]);
      expect(await ids(`assigneeId=${org.users.analyst.id}`)).toEqual([lead.formula]);
      expect(await ids('assigneeId=none')).toEqual([lead.priya, lead.hester]);
      const unassigned = leadSchema.parse(
        (await analyst.patch(`/orgs/${org.id}/leads/${lead.formula}`, { assigneeId: null }).expect(200)).body,
      );
      expect(unassigned).toMatchObject({ status: 'contacted', assignee: null });
      expect(unassigned.notes).toHaveLength(2);
    });

    it('refuses an assignee who is not a member, bad statuses and long notes, naming the field and changing nothing', async () => {
      const before = await t.db.sequelize.query('SELECT * FROM leads ORDER BY id', {
        type: QueryTypes.SELECT,
      });
      for (const [body, field] of [
        [{ assigneeId: other.users.analyst.id }, 'body.assigneeId'],
        [{ assigneeId: 4_000_000_000 }, 'body.assigneeId'],
        [{ status: 'won' }, 'body.status'],
        [{ notes: 'no longer set here' }, 'body.notes'],
        [{ status: 'qualified', colour: 'red' }, 'body.colour'],
        [{ assigneeId: 'me' }, 'body.assigneeId'],
      ] as const) {
        const res = await analyst.patch(`/orgs/${org.id}/leads/${lead.hester}`, body).expect(400);
        expect(fieldsOf(res.body), JSON.stringify(body).slice(0, 60)).toEqual([field]);
      }
      expect(
        await t.db.sequelize.query('SELECT * FROM leads ORDER BY id', { type: QueryTypes.SELECT }),
      ).toEqual(before);
      const notesBefore = await t.db.sequelize.query('SELECT * FROM lead_notes ORDER BY id', {
        type: QueryTypes.SELECT,
      });
      for (const [body, field] of [
        [{ body: 'x'.repeat(5001) }, 'body.body'],
        [{ body: '   ' }, 'body.body'],
        [{}, 'body.body'],
        [{ body: 'fine', pinned: true }, 'body.pinned'],
      ] as const) {
        const res = await analyst.post(`/orgs/${org.id}/leads/${lead.hester}/notes`, body).expect(400);
        expect(fieldsOf(res.body), JSON.stringify(body).slice(0, 60)).toEqual([field]);
      }
      expect(
        await t.db.sequelize.query('SELECT * FROM lead_notes ORDER BY id', { type: QueryTypes.SELECT }),
      ).toEqual(notesBefore);
      await analyst
        .post(`/orgs/${org.id}/leads/${lead.hester}/notes`, { body: 'x'.repeat(5000) })
        .expect(201);
    });

    it("answers 404 for another organisation's lead, and a developer may not change one", async () => {
      await analyst.patch(`/orgs/${org.id}/leads/${lead.fenwick}`, { status: 'closed' }).expect(404);
      await analyst.get(`/orgs/${org.id}/leads/${lead.fenwick}`).expect(404);
      await developer.patch(`/orgs/${org.id}/leads/${lead.hester}`, { status: 'closed' }).expect(403);
    });

    it('opens with the run it came from and its working', async () => {
      const d = leadDetailSchema.parse(
        (await analyst.get(`/orgs/${org.id}/leads/${lead.priya}`).expect(200)).body,
      );
      expect(d.run?.id).toBe(runOf.priya);
      expect(d.run?.widget.id).toBe(soil.id);
      expect((d.run?.serverResult as { working: unknown[] }).working.length).toBeGreaterThan(0);
      expect(d.run?.lead).toMatchObject({ id: lead.priya, name: 'Priya Venn' });
    });
  });

  describe('erasing personal data', () => {
    it("erases the visitor's details and the notes, keeps status, times and the run's link (usage unchanged), and nothing of another organisation changes", async () => {
      await analyst.patch(`/orgs/${org.id}/leads/${lead.hester}`, { status: 'qualified' }).expect(200);
      await analyst
        .post(`/orgs/${org.id}/leads/${lead.hester}/notes`, { body: 'Hester prefers mornings.' })
        .expect(201);
      const before = leadSchema.parse(
        (await analyst.get(`/orgs/${org.id}/leads/${lead.hester}`).expect(200)).body,
      );
      const theirs = await otherRows();
      const rollupsBefore = await storedRollups(t.db.sequelize);
      const erased = leadSchema.parse(
        (await analyst.delete(`/orgs/${org.id}/leads/${lead.hester}/personal-data`).expect(200)).body,
      );
      expect(erased).toMatchObject({
        id: lead.hester,
        status: 'qualified',
        name: null,
        email: null,
        company: null,
        phone: null,
        message: null,
        siteAddress: null,
        notes: [],
        runId: runOf.hester,
        createdAt: before.createdAt,
        updatedAt: before.updatedAt,
      });
      expect(erased.erasedAt).toEqual(expect.any(String));
      const row = await t.db.sequelize.query<Record<string, unknown>>('SELECT * FROM leads WHERE id = ?', {
        replacements: [lead.hester],
        type: QueryTypes.SELECT,
      });
      expect(JSON.stringify(row)).not.toMatch(/Hester|Quayle|Mill Lane|mornings/);
      expect(
        await t.db.sequelize.query('SELECT * FROM lead_notes WHERE lead_id = ?', {
          replacements: [lead.hester],
          type: QueryTypes.SELECT,
        }),
      ).toEqual([]);
      // An erased enquiry takes no new notes.
      const refused = await analyst
        .post(`/orgs/${org.id}/leads/${lead.hester}/notes`, { body: 'Hester again' })
        .expect(400);
      expect(fieldsOf(refused.body)).toEqual(['body.body']);
      // The run stays linked: usage statistics (runs that led to an enquiry) do not change.
      const run = runDetailSchema.parse(
        (await analyst.get(`/orgs/${org.id}/runs/${runOf.hester}`).expect(200)).body,
      );
      expect(run.leadId).toBe(lead.hester);
      const [stored, raw] = await Promise.all([
        storedRollups(t.db.sequelize),
        rollupsFromRaw(t.db.sequelize),
      ]);
      expect(stored).toEqual(raw);
      expect(stored).toEqual(rollupsBefore);
      expect(await otherRows()).toBe(theirs);
      // Still listed, as erased, and no longer found by what was erased.
      expect((await list('')).items.find((l) => l.id === lead.hester)).toMatchObject({
        erasedAt: erased.erasedAt,
        status: 'qualified',
      });
      expect(await ids('q=Quayle')).toEqual([]);
      const detail = leadDetailSchema.parse(
        (await analyst.get(`/orgs/${org.id}/leads/${lead.hester}`).expect(200)).body,
      );
      expect(detail.run?.id).toBe(runOf.hester);
    });

    it('erasing again changes nothing; another organisation cannot erase it; a developer may not', async () => {
      const first = leadSchema.parse(
        (await analyst.get(`/orgs/${org.id}/leads/${lead.hester}`).expect(200)).body,
      );
      const again = leadSchema.parse(
        (await analyst.delete(`/orgs/${org.id}/leads/${lead.hester}/personal-data`).expect(200)).body,
      );
      expect(again).toEqual(first);
      const before = await t.db.sequelize.query('SELECT * FROM leads ORDER BY id', {
        type: QueryTypes.SELECT,
      });
      await otherAnalyst.delete(`/orgs/${other.id}/leads/${lead.priya}/personal-data`).expect(404);
      await otherAnalyst.delete(`/orgs/${org.id}/leads/${lead.priya}/personal-data`).expect(404);
      await developer.delete(`/orgs/${org.id}/leads/${lead.priya}/personal-data`).expect(403);
      expect(
        await t.db.sequelize.query('SELECT * FROM leads ORDER BY id', { type: QueryTypes.SELECT }),
      ).toEqual(before);
    });
  });

  describe('CSV export', () => {
    it('downloads the filtered leads with a header row, quoted where needed and guarded against formulas', async () => {
      const res = await analyst.get(`/orgs/${org.id}/leads/export`).expect(200);
      expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
      expect(res.headers['content-disposition']).toMatch(
        /^attachment; filename="t-[0-9a-f]+-leads-\d{4}-\d{2}-\d{2}\.csv"$/,
      );
      expect(res.text.startsWith(UTF8_BOM)).toBe(true);
      const [header, ...rows] = readCsv(res.text);
      expect(header).toEqual([
        'Lead',
        'Received (UTC)',
        'Updated (UTC)',
        'Status',
        'Widget',
        'Name',
        'E-mail',
        'Company',
        'Phone',
        'Site address',
        'Message',
        'Assignee',
        'Notes',
        'Site',
        'Run',
        'Erased (UTC)',
      ]);
      expect(rows.map((r) => Number(r[0]))).toEqual([lead.priya, lead.formula, lead.hester]);
      const formula = rows[1]!;
      expect(formula[5]).toBe(`'=HYPERLINK("http://evil.example","click")`);
      expect(formula[7]).toBe("'+44 Builders");
      expect(res.text).toContain(`"'=HYPERLINK(""http://evil.example"",""click"")"`);
      // The status in the words the dashboard shows, not the stored code.
      expect(formula[3]).toBe('Replied');
      // The erased lead: its status and times stay, its person is gone.
      const erased = rows[2]!;
      expect(erased.slice(5, 11)).toEqual(['', '', '', '', '', '']);
      expect(erased[3]).toBe('Visit proposed');
      expect(erased[15]).toMatch(/^\d{4}-\d{2}-\d{2}T/);
      expect(
        (await analyst.get(`/orgs/${org.id}/leads/export?status=new`).expect(200)).text.split('\r\n').length,
      ).toBe(3);
    });

    it('keeps a message with line breaks, commas and quotes in one cell', async () => {
      await analyst
        .post(`/orgs/${org.id}/leads/${lead.priya}/notes`, { body: 'Rang twice,\r\nno answer; "try email"' })
        .expect(201);
      const rows = readCsv(
        (await analyst.get(`/orgs/${org.id}/leads/export?widgetId=${soil.id}`).expect(200)).text,
      );
      expect(rows).toHaveLength(2);
      expect(rows[1]![12]).toMatch(
        /^\d{4}-\d{2}-\d{2} \d{2}:\d{2} .+: Rang twice,\r\nno answer; "try email"$/,
      );
      expect(rows[1]![7]).toBe('Venn & Co 50%');
    });
  });
});
