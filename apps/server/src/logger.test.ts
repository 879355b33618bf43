import { describe, expect, it } from 'vitest';
import express from 'express';
import request from 'supertest';
import { pinoHttp } from 'pino-http';
import { createLogger } from './logger.js';

describe('request logging', () => {
  it('keeps session and CSRF tokens out of the log, in requests and in responses', async () => {
    const lines: string[] = [];
    const logger = createLogger({ logLevel: 'info' }, { write: (line: string) => void lines.push(line) });
    const app = express();
    app.use(pinoHttp({ logger }));
    app.get('/', (_req, res) => {
      res.cookie('wst_session', 'SESSION-SECRET').json({});
    });
    await request(app)
      .get('/')
      .set('Cookie', 'wst_session=COOKIE-SECRET')
      .set('x-csrf-token', 'CSRF-SECRET')
      .expect(200);
    const log = lines.join('');
    expect(log).toContain('"statusCode":200');
    for (const secret of ['SESSION-SECRET', 'COOKIE-SECRET', 'CSRF-SECRET'])
      expect(log).not.toContain(secret);
  });
});
