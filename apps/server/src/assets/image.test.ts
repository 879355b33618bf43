import { describe, expect, it } from 'vitest';
import { inspectImage, MAX_LOGO_BYTES } from './image.js';
import { AppError } from '../errors.js';
import { makePng } from '../../testing/images.js';

function refusal(buf: Buffer): string {
  try {
    inspectImage(buf);
  } catch (e) {
    expect(e).toBeInstanceOf(AppError);
    return (e as AppError).message;
  }
  throw new Error('expected a refusal');
}

describe('inspectImage', () => {
  it('accepts a PNG and reads its size', () => {
    expect(inspectImage(makePng(40, 20))).toEqual({ contentType: 'image/png', width: 40, height: 20 });
  });

  it('refuses a script whatever its name', () => {
    expect(refusal(Buffer.from('<script>alert(1)</script>'))).toMatch(/PNG, JPEG or WebP/);
  });

  it('refuses SVG, which can carry script', () => {
    const svg = Buffer.from(
      '<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"><rect width="1" height="1"/></svg>',
    );
    expect(refusal(svg)).toMatch(/PNG, JPEG or WebP/);
  });

  it('refuses a PNG signature followed by junk', () => {
    expect(
      refusal(Buffer.concat([makePng(2, 2).subarray(0, 8), Buffer.from('not really a png at all')])),
    ).toMatch(/cannot be read|does not match/);
  });

  it('refuses a file over the size limit', () => {
    const big = Buffer.concat([makePng(2, 2), Buffer.alloc(MAX_LOGO_BYTES)]);
    expect(refusal(big)).toMatch(/larger than 512 KB/);
  });
});
