import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import {
  createTestApp,
  seedOrgWithTeam,
  TestClient,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { binary, pdfText } from '../../testing/pdf.js';
import { liveWidget, reportRun, SITE } from '../../testing/usage.js';

// The trade calculators' runs take the same path to a calculation sheet as the others: their
// results in the new units, their sources, and a withheld figure named with its reason.

describe('calculation sheets of the trade calculators', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let owner: TestClient;

  beforeAll(async () => {
    t = await createTestApp();
    org = await seedOrgWithTeam();
    owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
  });
  afterAll(async () => {
    await t.close();
  });

  it.each([
    ['rising-damp-height', {}, ['0.794 m', '55.6 L/m', '1.59 L/(m·day)', 'Hall C., Hoff W. D. (2007)']],
    ['contact-angle-from-force', { readings: 'cycle' }, ['59.8°', '39.2°', '20.6°', 'ASTM D1331-20']],
    ['tension-from-rise', {}, ['61.6 mN/m', 'Lord Rayleigh (1915)']],
    [
      'frost-screening',
      { d10: 0.03e-3 },
      ['not defined here', 'No. 200 sieve', 'ASTM D5918', 'EN ISO 13793'],
    ],
  ] as const)('%s %o prints %o', async (id, inputs, expected) => {
    const widget = await liveWidget(owner, org.id, `Trade ${id}`, id, [SITE]);
    const runId = await reportRun(t.app, widget, inputs);
    const res = await request(t.app)
      .get(`/api/v1/embed/runs/${runId}/sheet`)
      .query({ publicKey: widget.publicKey })
      .set('Origin', SITE)
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const text = pdfText(res.body as Buffer);
    for (const piece of expected) expect(text).toContain(piece);
  });
});
