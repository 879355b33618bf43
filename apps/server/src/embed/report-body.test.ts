import { randomUUID } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import { embedRunBodySchema, type Widget } from '@wickstone/contracts';
import {
  createLiveWidget,
  createTestApp,
  runReportBody,
  seedOrgWithTeam,
  TestClient,
  type TestApp,
} from '../../testing/index.js';
import { runBodySchema } from './router.js';

const SITE = 'https://www.polwithen-damp.example';

// The run-report route reads a widget's report itself (a plain UTF-8 body of a known length) and
// leaves every other request to body-parser: both must give the same answers.
describe('the run report body', () => {
  let t: TestApp;
  let widget: Widget;

  beforeAll(async () => {
    t = await createTestApp();
    const org = await seedOrgWithTeam();
    const owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    widget = await createLiveWidget(owner, org.id, 'Body rise', [SITE]);
  });
  afterAll(() => t.close());

  const post = (contentType: string, body: string | Buffer, extra: Record<string, string> = {}) =>
    request(t.app)
      .post('/api/v1/embed/runs')
      .set('Origin', SITE)
      .set('Content-Type', contentType)
      .set(extra)
      .send(body);
  const report = () => JSON.stringify(runReportBody(widget.publicKey, { id: randomUUID() }));

  it.each([
    'text/plain;charset=UTF-8',
    'text/plain',
    'application/json',
    'application/json; charset=utf-8',
    // Not among the types read directly: body-parser reads these.
    'text/plain; charset="utf-8"',
    'Text/Plain; Charset=UTF-8',
  ])('stores a report sent as %s', async (type) => {
    const res = await post(type, report()).expect(201);
    expect(res.body).toMatchObject({ agreed: true, duplicate: false });
  });

  it('drops a byte order mark before the JSON, as body-parser does', async () => {
    await post('text/plain', `\uFEFF${report()}`).expect(201);
    await post('text/plain; charset="utf-8"', `\uFEFF${report()}`).expect(201);
  });

  it('reads a report sent in several chunks', async () => {
    const text = report();
    const req = request(t.app)
      .post('/api/v1/embed/runs')
      .set('Origin', SITE)
      .set('Content-Type', 'text/plain')
      .set('Content-Length', String(Buffer.byteLength(text)));
    // supertest's request: written in pieces before it ends.
    for (let i = 0; i < text.length; i += 200) void req.write(text.slice(i, i + 200));
    await req.expect(201);
  });

  it('a compressed report is read by body-parser', async () => {
    await post('text/plain', gzipSync(report()), { 'Content-Encoding': 'gzip' }).expect(201);
  });

  it('the same answers as body-parser for bad bodies', async () => {
    // Malformed JSON, on both paths.
    for (const type of ['text/plain', 'text/plain; charset="utf-8"']) {
      const res = await post(type, '{"id": ').expect(400);
      expect(res.body.error).toMatchObject({
        code: 'bad_request',
        details: { fields: [{ field: 'body', message: 'Malformed JSON' }] },
      });
    }
    // Too large: 413 whether or not the length is declared up front.
    const big = JSON.stringify({ pad: 'x'.repeat(40_000) });
    expect((await post('text/plain', big).expect(413)).body.error.code).toBe('payload_too_large');
    // Another charset.
    expect((await post('text/plain; charset=koi8-x', report()).expect(415)).body.error.code).toBe(
      'unsupported_media_type',
    );
    // A type neither path reads: no body, so the body is the field named.
    const res = await post('text/csv', report()).expect(400);
    expect(res.body.error.details.fields[0].field).toBe('body');
  });

  it("uses zod's compiled parser, which answers as the schema does", () => {
    // z.compile hands the schema back unchanged when it cannot compile it.
    expect(runBodySchema).not.toBe(embedRunBodySchema);
    const good = runReportBody(widget.publicKey, { id: randomUUID(), pageUrl: `${SITE}/a` });
    expect(runBodySchema.parse(good)).toEqual(embedRunBodySchema.parse(good));
    const bad = [
      { ...good, id: 'not-a-uuid' },
      { ...good, extra: 1 },
      { ...good, pageUrl: 'javascript:alert(1)' },
      { ...good, inputs: { diameter: 'x'.repeat(61) } },
      { ...good, result: { ...good.result, outputs: { h: Number.NaN } } },
      { ...good, unitSystem: 'imperial' },
    ];
    for (const b of bad) {
      const compiled = runBodySchema.safeParse(b);
      expect(compiled.success).toBe(false);
      expect(compiled.error?.issues).toEqual(embedRunBodySchema.safeParse(b).error?.issues);
    }
  });
  it("answers a widget's report before Express dispatches, with the Express path's headers and errors", async () => {
    // Express's router sees only what the hot path leaves to it.
    const router = (t.app as unknown as { router: { handle: () => void } }).router;
    const handle = vi.spyOn(router, 'handle');
    try {
      const quick = await post('text/plain;charset=UTF-8', report()).expect(201);
      expect(handle).not.toHaveBeenCalled();
      const viaExpress = await post('text/plain; charset="utf-8"', report()).expect(201);
      expect(handle).toHaveBeenCalledTimes(1);
      for (const res of [quick, viaExpress]) {
        expect(res.headers).toMatchObject({
          'access-control-allow-origin': SITE,
          'access-control-expose-headers': 'Retry-After',
          vary: 'Origin',
          'cache-control': 'no-store',
          'content-type': 'application/json; charset=utf-8',
        });
      }
      // Failures on the hot path: the one error shape, and no CORS answer for a foreign page.
      const foreign = await request(t.app)
        .post('/api/v1/embed/runs')
        .set('Origin', 'https://copycat.example')
        .set('Content-Type', 'text/plain')
        .send(report())
        .expect(403);
      expect(foreign.body.error.code).toBe('forbidden');
      expect(foreign.headers['access-control-allow-origin']).toBeUndefined();
      const unnamed = await post('text/plain', JSON.stringify({ ...JSON.parse(report()), id: 'x' })).expect(
        400,
      );
      expect(unnamed.body.error.details.fields.map((f: { field: string }) => f.field)).toEqual(['body.id']);
      expect(unnamed.headers['access-control-allow-origin']).toBe(SITE);
      expect(handle).toHaveBeenCalledTimes(1);
    } finally {
      handle.mockRestore();
    }
  });
});
