import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createApp } from './app.js';
import type { Config } from './config.js';
import { createLogger } from './logger.js';
import { createTestDatabase, type TestDatabase } from '../testing/index.js';

// REQUEST_LOG: what a request leaves in the log, from the whole record down to nothing.
describe('request log modes', () => {
  let db: TestDatabase;
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(() => db.drop());

  async function logOf(mode: Config['requestLog'], route: 'other' | 'runs' = 'other'): Promise<string[]> {
    const lines: string[] = [];
    const logger = createLogger({ logLevel: 'info' }, { write: (l: string) => void lines.push(l) });
    const app = createApp({ config: { ...db.config, requestLog: mode }, sequelize: db.sequelize, logger });
    const probe = (r: request.Test) =>
      r.set('User-Agent', 'log-probe/1.0').set('Origin', 'https://www.log-probe.example');
    if (route === 'other') await probe(request(app).get('/api/v1/no-such-route')).expect(404);
    // The run-report route has a request log of its own: the same records.
    else
      await probe(request(app).post('/api/v1/embed/runs'))
        .set('Content-Type', 'text/plain')
        .send('{"id": 1}')
        .expect(400);
    return lines;
  }

  it('json: the request and response records', async () => {
    const lines = await logOf('json');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toContain('"statusCode":404');
    expect(lines[0]).toContain('"url":"/api/v1/no-such-route"');
    // Which request it was, and no header beyond the origin.
    const { req } = JSON.parse(lines[0]!) as { req: Record<string, unknown> };
    expect(req).toEqual({
      id: expect.anything(),
      method: 'GET',
      url: '/api/v1/no-such-route',
      origin: 'https://www.log-probe.example',
      remoteAddress: expect.stringMatching(/127\.0\.0\.1/),
    });
    expect(lines[0]).not.toContain('log-probe/1.0');
  });

  it('line: one short line per request, no headers', async () => {
    const lines = await logOf('line');
    expect(lines).toHaveLength(1);
    const { msg } = JSON.parse(lines[0]!) as { msg: string };
    expect(msg).toMatch(/^GET \/api\/v1\/no-such-route 404 \d+ ms$/);
    expect(lines[0]).not.toContain('log-probe');
    expect(lines[0]).not.toContain('"req":');
    expect(lines[0]!.length).toBeLessThan(200);
  });

  it('off: nothing for an ordinary request', async () => {
    expect(await logOf('off')).toEqual([]);
  });

  it('the run-report route: the same record, line and silence', async () => {
    const [json, ...more] = await logOf('json', 'runs');
    expect(more).toEqual([]);
    const record = JSON.parse(json!) as Record<string, unknown>;
    expect(record).toMatchObject({ level: 40, res: { statusCode: 400 }, msg: 'request completed' });
    expect(record.responseTime).toEqual(expect.any(Number));
    expect(record.req).toEqual({
      id: expect.anything(),
      method: 'POST',
      url: '/api/v1/embed/runs',
      origin: 'https://www.log-probe.example',
      remoteAddress: expect.stringMatching(/127\.0\.0\.1/),
    });
    expect(json).not.toContain('log-probe/1.0');

    const lines = await logOf('line', 'runs');
    expect(lines).toHaveLength(1);
    expect((JSON.parse(lines[0]!) as { msg: string }).msg).toMatch(
      /^POST \/api\/v1\/embed\/runs 400 \d+ ms$/,
    );
    expect(lines[0]).not.toContain('log-probe');
    expect(lines[0]).not.toContain('"req":');

    expect(await logOf('off', 'runs')).toEqual([]);
  });
});
