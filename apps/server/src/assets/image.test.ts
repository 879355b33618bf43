import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { cleanImage, MAX_LOGO_BYTES } from './image.js';
import { AppError } from '../errors.js';
import { makePng, makeZip } from '../../testing/images.js';

async function refusal(buf: Buffer): Promise<string> {
  try {
    await cleanImage(buf);
  } catch (e) {
    expect(e).toBeInstanceOf(AppError);
    expect((e as AppError).details).toMatchObject({ fields: [{ field: 'file' }] });
    return (e as AppError).message;
  }
  throw new Error('expected a refusal');
}

const HTML = Buffer.from('<html><body><script>alert(document.cookie)</script></body></html>');

const makeZipOfHtml = () => makeZip('payload.html', HTML);

describe('cleanImage', () => {
  it('accepts a PNG, reads its size and hands back a decoded, re-encoded PNG', async () => {
    const out = await cleanImage(makePng(40, 20));
    expect(out).toMatchObject({ contentType: 'image/png', width: 40, height: 20 });
    expect((await sharp(out.data).metadata()).format).toBe('png');
  });

  it('refuses a script whatever its name', async () => {
    expect(await refusal(Buffer.from('<script>alert(1)</script>'))).toMatch(/PNG, JPEG or WebP/);
  });

  it('refuses SVG, which can carry script', async () => {
    const svg = Buffer.from(
      '<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"><rect width="1" height="1"/></svg>',
    );
    expect(await refusal(svg)).toMatch(/PNG, JPEG or WebP/);
  });

  it('refuses a polyglot: a valid PNG header followed by HTML', async () => {
    const header = makePng(2, 2).subarray(0, 33); // signature + IHDR
    expect(await refusal(Buffer.concat([header, HTML]))).toMatch(/cannot be read/);
  });

  it('refuses a polyglot: a valid PNG header followed by a ZIP archive', async () => {
    const header = makePng(2, 2).subarray(0, 33);
    expect(await refusal(Buffer.concat([header, makeZipOfHtml()]))).toMatch(/cannot be read/);
  });

  it('keeps only the pixels of a whole PNG with an archive and HTML appended', async () => {
    const png = makePng(8, 8);
    const out = await cleanImage(Buffer.concat([png, makeZipOfHtml(), HTML]));
    expect(out.data.includes(Buffer.from('PK\u0003\u0004', 'latin1'))).toBe(false);
    expect(out.data.includes(Buffer.from('<script>'))).toBe(false);
    expect(out).toMatchObject({ width: 8, height: 8 });
  });

  it('strips metadata (EXIF) from a JPEG', async () => {
    const withExif = await sharp({ create: { width: 16, height: 16, channels: 3, background: '#3a7' } })
      .jpeg()
      .withExif({ IFD0: { Copyright: 'secret-location-note', Artist: 'someone' } })
      .toBuffer();
    expect(withExif.includes(Buffer.from('secret-location-note'))).toBe(true);
    const out = await cleanImage(withExif);
    expect(out.contentType).toBe('image/jpeg');
    expect(out.data.includes(Buffer.from('secret-location-note'))).toBe(false);
    expect((await sharp(out.data).metadata()).exif).toBeUndefined();
  });

  it('refuses a truncated PNG', async () => {
    const png = makePng(30, 30);
    expect(await refusal(png.subarray(0, png.length - 20))).toMatch(/cannot be read/);
  });

  it('refuses a file over the size limit', async () => {
    const big = Buffer.concat([makePng(2, 2), Buffer.alloc(MAX_LOGO_BYTES)]);
    expect(await refusal(big)).toMatch(/larger than 512 KB/);
  });
});
