import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type request from 'supertest';

/** A PDF's text as Debian's poppler-utils reads it, whitespace collapsed so wrapped lines still match. */
export function pdfText(pdf: Buffer): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'wst-pdf-'));
  try {
    const file = path.join(dir, 'sheet.pdf');
    writeFileSync(file, pdf);
    return execFileSync('pdftotext', ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** A supertest parser that keeps a PDF as bytes; an error answer (JSON) is parsed as usual. */
export function binary(res: request.Response, cb: (err: Error | null, body: unknown) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => {
    const all = Buffer.concat(chunks);
    cb(null, /json/.test(String(res.headers['content-type'])) ? JSON.parse(all.toString('utf8')) : all);
  });
}
