import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import express from 'express';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { errorHandler } from '../errors.js';
import { releasesRouter } from './router.js';

// A release folder as the widget build writes it: each script with a brotli and a gzip copy.
const dir = mkdtempSync(path.join(tmpdir(), 'wst-releases-'));
const script = Buffer.from(`Wickstone._d("9.9.9/runtime-x.js",function(r){return{a:1}});\n`.repeat(20));
mkdirSync(path.join(dir, '9.9.9'));
writeFileSync(path.join(dir, '9.9.9', 'runtime-x.js'), script);
writeFileSync(path.join(dir, '9.9.9', 'runtime-x.js.br'), brotliCompressSync(script));
writeFileSync(path.join(dir, '9.9.9', 'runtime-x.js.gz'), gzipSync(script));
writeFileSync(path.join(dir, '9.9.9', 'plain.js'), script);
writeFileSync(path.join(dir, '9.9.9', 'manifest.json'), '{}');

const app = express();
app.use('/releases', releasesRouter(dir));
app.use(errorHandler);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const parts: Buffer[] = [];
  res.on('data', (c: Buffer) => parts.push(c));
  res.on('end', () => cb(null, Buffer.concat(parts)));
};

describe('releases', () => {
  it('sends the brotli copy made at build time to a browser that takes it, cached for a year', async () => {
    const res = await request(app)
      .get('/releases/9.9.9/runtime-x.js')
      .set('Accept-Encoding', 'gzip, deflate, br')
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toBe('text/javascript; charset=utf-8');
    expect(res.headers.vary).toBe('Accept-Encoding');
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(res.headers['access-control-allow-origin']).toBe('*');
    // The build's copy went out as it is (the client decodes it back to the script).
    expect(Number(res.headers['content-length'])).toBe(brotliCompressSync(script).length);
    expect((res.body as Buffer).equals(script)).toBe(true);
  });

  it('sends the gzip copy when brotli is not taken, and the file itself when neither is', async () => {
    const gz = await request(app)
      .get('/releases/9.9.9/runtime-x.js')
      .set('Accept-Encoding', 'gzip')
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(gz.headers['content-encoding']).toBe('gzip');
    // The client inflates gzip itself: what arrives decoded is the script, byte for byte.
    expect((gz.body as Buffer).equals(script)).toBe(true);
    const plain = await request(app)
      .get('/releases/9.9.9/runtime-x.js')
      .set('Accept-Encoding', 'identity')
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.headers.vary).toBe('Accept-Encoding');
    expect((plain.body as Buffer).equals(script)).toBe(true);
  });

  it('sends a script without compressed copies as it is, and other files without Vary', async () => {
    const res = await request(app).get('/releases/9.9.9/plain.js').set('Accept-Encoding', 'br').expect(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    const manifest = await request(app).get('/releases/9.9.9/manifest.json').expect(200);
    expect(manifest.headers.vary).toBeUndefined();
  });

  it('answers 404 JSON for a missing file or a path out of the folder', async () => {
    const missing = await request(app)
      .get('/releases/9.9.9/nothing.js')
      .set('Accept-Encoding', 'br')
      .expect(404);
    expect((missing.body as { error: { code: string } }).error.code).toBe('not_found');
    await request(app).get('/releases/9.9.9/..%2F..%2Fsecret.js').set('Accept-Encoding', 'br').expect(404);
  });
});
