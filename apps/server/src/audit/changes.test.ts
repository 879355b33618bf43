import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditResponseSchema, type AuditEntry } from '@wickstone/contracts';
import { TestClient, createTestApp, type TestApp } from '../../testing/client.js';
import { seedOrgWithTeam, type FixtureOrg } from '../../testing/fixtures.js';
import { liveWidget, reportRun, requestAssessment, type FixtureWidget } from '../../testing/usage.js';

// Every change that matters leaves an entry in the organisation's audit log, with who, what and
// from where, in the same transaction as the change; a refused change leaves none.
describe('the audit log records changes to widgets, enquiries and retention', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let owner: TestClient;
  let analyst: TestClient;
  let widget: FixtureWidget;
  let leadId: number;

  const entries = async (type: AuditEntry['type']) =>
    auditResponseSchema
      .parse((await owner.get(`/orgs/${org.id}/audit?pageSize=200`).expect(200)).body)
      .items.filter((e) => e.type === type);

  beforeAll(async () => {
    t = await createTestApp({ LEAD_LIMIT_PER_IP: '1000' });
    org = await seedOrgWithTeam('Cold Harbour Moisture Surveys');
    owner = new TestClient(t.app);
    await owner.login(org.users.owner!.email, org.users.owner!.password);
    analyst = new TestClient(t.app);
    await analyst.login(org.users.analyst!.email, org.users.analyst!.password);
    widget = await liveWidget(owner, org.id, 'Cellar wall check', 'tube-rise');
    const runId = await reportRun(t.app, widget, { diameter: 0.0005 });
    leadId = await requestAssessment(t.app, widget, runId, {
      name: 'Ottilie Marsh',
      email: 'ottilie.marsh@cellars.example',
    });
  });
  afterAll(() => t.close());

  it('records a widget created and changed, naming the changed settings and the status move', async () => {
    const created = await entries('widget.created');
    expect(created).toEqual([
      expect.objectContaining({
        subject: 'Cellar wall check',
        actor: expect.objectContaining({ id: org.users.owner!.id }),
        details: { widgetId: widget.id, calculatorId: 'tube-rise' },
        ip: expect.stringMatching(/127\.0\.0\.1/),
      }),
    ]);
    // liveWidget itself went from draft to live.
    const wentLive = (await entries('widget.updated')).find((e) => e.details.status);
    expect(wentLive?.details).toMatchObject({ widgetId: widget.id, status: { from: 'draft', to: 'live' } });

    await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { name: 'Cellar wall check (v2)' }).expect(200);
    const renamed = (await entries('widget.updated'))[0];
    expect(renamed).toMatchObject({ subject: 'Cellar wall check (v2)', details: { changed: ['name'] } });
  });

  it('records nothing for a refused or empty change', async () => {
    const before = (await entries('widget.updated')).length;
    await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { allowedOrigins: [] }).expect(400);
    await owner.patch(`/orgs/${org.id}/widgets/${widget.id}`, { name: 'Cellar wall check (v2)' }).expect(200);
    expect(await entries('widget.updated')).toHaveLength(before);
  });

  it("records an enquiry's status and assignee changes and each note added, never the note's text", async () => {
    await analyst
      .patch(`/orgs/${org.id}/leads/${leadId}`, {
        status: 'contacted',
        assigneeId: org.users.analyst!.id,
      })
      .expect(200);
    await analyst
      .post(`/orgs/${org.id}/leads/${leadId}/notes`, { body: 'Ottilie asked for a visit on a Tuesday.' })
      .expect(201);
    const [entry] = await entries('lead.updated');
    expect(entry).toMatchObject({
      actor: expect.objectContaining({ id: org.users.analyst!.id }),
      details: {
        leadId,
        status: { from: 'new', to: 'contacted' },
        assigneeId: { from: null, to: org.users.analyst!.id },
      },
    });
    const [note] = await entries('lead.note_added');
    expect(note).toMatchObject({ details: { leadId } });
    expect(JSON.stringify([entry, note])).not.toMatch(/Tuesday|Ottilie/);
  });

  it('records an erasure once, and retention changes with the old and new period', async () => {
    await analyst.delete(`/orgs/${org.id}/leads/${leadId}/personal-data`).expect(200);
    await analyst.delete(`/orgs/${org.id}/leads/${leadId}/personal-data`).expect(200);
    expect(await entries('lead.erased')).toEqual([expect.objectContaining({ details: { leadId } })]);

    await owner.patch(`/orgs/${org.id}/settings/retention`, { months: 24 }).expect(200);
    await owner.patch(`/orgs/${org.id}/settings/retention`, { months: 24 }).expect(200);
    await owner.patch(`/orgs/${org.id}/settings/retention`, { months: null }).expect(200);
    expect((await entries('retention.changed')).map((e) => e.details)).toEqual([
      { months: { from: 24, to: null } },
      { months: { from: null, to: 24 } },
    ]);
  });
});
