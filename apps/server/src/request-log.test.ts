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

  async function logOf(mode: Config['requestLog']): Promise<string[]> {
    const lines: string[] = [];
    const logger = createLogger({ logLevel: 'info' }, { write: (l: string) => void lines.push(l) });
    const app = createApp({ config: { ...db.config, requestLog: mode }, sequelize: db.sequelize, logger });
    await request(app)
      .get('/api/v1/no-such-route')
      .set('User-Agent', 'log-probe/1.0')
      .set('Origin', 'https://www.log-probe.example')
      .expect(404);
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
});
