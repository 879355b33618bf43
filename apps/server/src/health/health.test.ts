import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import { errorBodySchema, healthResponseSchema } from '@wickstone/contracts';
import { createApp } from '../app.js';
import { createLogger } from '../logger.js';
import { createTestDatabase, type TestDatabase } from '../../testing/db.js';

describe('GET /api/v1/health', () => {
  let db: TestDatabase;
  let app: Express;
  beforeAll(async () => {
    db = await createTestDatabase();
    app = createApp({ config: db.config, sequelize: db.sequelize, logger: createLogger(db.config) });
  });
  afterAll(async () => {
    await db.drop();
  });

  it('reports the database round trip', async () => {
    const t0 = performance.now();
    const res = await request(app).get('/api/v1/health').expect(200).expect('Content-Type', /json/);
    const requestMs = performance.now() - t0;
    const body = healthResponseSchema.parse(res.body);
    expect(body.database.status).toBe('up');
    // A measured figure, not a speed limit: positive, and part of the request it was measured in
    // (so never longer than the whole request; 0.01 ms for the rounding to two decimals).
    expect(body.database.roundTripMs).toBeGreaterThan(0);
    expect(body.database.roundTripMs).toBeLessThanOrEqual(requestMs + 0.01);
    expect(res.headers['cache-control']).toBe('no-store');
  });

  it("logs a request's line without its headers: which request, from where, and how it ended", async () => {
    const lines: string[] = [];
    const logged = createApp({
      config: db.config,
      sequelize: db.sequelize,
      logger: createLogger({ logLevel: 'info' }, { write: (line: string) => void lines.push(line) }),
    });
    await request(logged)
      .get('/api/v1/no-such-thing?x=1')
      .set('Origin', 'https://www.penrose-geotechnical.example')
      .set('Cookie', 'wst_session=COOKIE-SECRET')
      .set('User-Agent', 'UA-OF-A-VISITOR')
      .expect(404);
    const entries = lines.map((l) => JSON.parse(l) as { req?: Record<string, unknown>; res?: unknown });
    const entry = entries.find((e) => e.req?.url === '/api/v1/no-such-thing?x=1');
    expect(entry?.req).toMatchObject({ method: 'GET', origin: 'https://www.penrose-geotechnical.example' });
    expect(Object.keys(entry?.req ?? {}).sort()).toEqual(['id', 'method', 'origin', 'remoteAddress', 'url']);
    expect(entry?.res).toEqual({ statusCode: 404 });
    for (const secret of ['COOKIE-SECRET', 'UA-OF-A-VISITOR']) expect(lines.join('')).not.toContain(secret);
  });

  it('answers an unknown API route with the one error shape', async () => {
    const res = await request(app).get('/api/v1/no-such-thing').expect(404);
    expect(errorBodySchema.parse(res.body).error.code).toBe('not_found');
  });

  it('refuses malformed JSON with 400, naming the body, without a stack trace', async () => {
    const res = await request(app)
      .post('/api/v1/health')
      .set('Content-Type', 'application/json')
      .send('{"a":');
    expect(res.status).toBe(400);
    const body = errorBodySchema.parse(res.body);
    expect(body.error.details).toEqual({ fields: [{ field: 'body', message: 'Malformed JSON' }] });
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.(ts|js):\d+/);
  });

  it('refuses an oversized body with 413', async () => {
    const big = JSON.stringify({ blob: 'x'.repeat(100 * 1024) });
    const res = await request(app).post('/api/v1/health').set('Content-Type', 'application/json').send(big);
    expect(res.status).toBe(413);
    expect(errorBodySchema.parse(res.body).error.code).toBe('payload_too_large');
  });
});
