import { spawn, type ChildProcess } from 'node:child_process';
import { afterEach, describe, expect, it } from 'vitest';
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

/*
 * The app's own destination (stdout, written asynchronously in blocks), seen from outside: a child
 * process logs through createLogger() and the test reads its stdout.
 */
describe('the log written to stdout', () => {
  const loggerModule = new URL('./logger.ts', import.meta.url).href;
  const started: ChildProcess[] = [];
  afterEach(() => {
    for (const c of started.splice(0)) if (c.exitCode === null && c.signalCode === null) c.kill('SIGKILL');
  });

  function logFrom(script: string): {
    child: ChildProcess;
    lines: () => string[];
    exited: Promise<number | null>;
  } {
    const child = spawn(
      process.execPath,
      [
        '--import',
        'tsx',
        '--input-type=module',
        '-e',
        `import { createLogger } from '${loggerModule}';\n${script}`,
      ],
      { stdio: ['ignore', 'pipe', 'inherit'] },
    );
    started.push(child);
    let out = '';
    child.stdout!.on('data', (d: Buffer) => (out += d.toString()));
    const exited = new Promise<number | null>((resolve) => child.once('close', (code) => resolve(code)));
    return { child, lines: () => out.split('\n').filter(Boolean), exited };
  }

  it('writes what is still buffered when the process exits at once', async () => {
    const { lines, exited } = logFrom(
      `const log = createLogger({ logLevel: 'info' });
       for (let i = 0; i < 3; i++) log.info({ n: i }, 'report stored');
       process.exit(0);`,
    );
    expect(await exited).toBe(0);
    expect(lines().map((l) => (JSON.parse(l) as { n: number }).n)).toEqual([0, 1, 2]);
  });

  it('writes a lone line while the process keeps running', async () => {
    const { child, lines, exited } = logFrom(
      `const log = createLogger({ logLevel: 'info' });
       log.info({ n: 7 }, 'one quiet request');
       setInterval(() => {}, 1000);`,
    );
    // The process never exits by itself: the line can only come from the periodic flush.
    while (lines().length === 0 && child.exitCode === null) await new Promise((r) => setTimeout(r, 50));
    expect(child.exitCode).toBeNull();
    child.kill('SIGKILL');
    await exited;
    expect(lines().map((l) => (JSON.parse(l) as { n: number }).n)).toEqual([7]);
  });
});
