import sharp from 'sharp';
import type { ImageType } from '@wickstone/contracts';
import { fieldError } from '../errors.js';

export const MAX_LOGO_BYTES = 512 * 1024;
const MAX_SIDE_PX = 4096;

/** Magic numbers: PNG (ISO/IEC 15948 signature), JPEG (SOI + marker), WebP (RIFF container, "WEBP" form). */
function sniff(buf: Buffer): ImageType | null {
  if (
    buf.length >= 8 &&
    buf.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))
  ) {
    return 'image/png';
  }
  if (buf.length >= 3 && buf[0] === 0xff && buf[1] === 0xd8 && buf[2] === 0xff) return 'image/jpeg';
  if (
    buf.length >= 12 &&
    buf.toString('latin1', 0, 4) === 'RIFF' &&
    buf.toString('latin1', 8, 12) === 'WEBP'
  ) {
    return 'image/webp';
  }
  return null;
}

const formatTypes: Record<string, ImageType> = { png: 'image/png', jpeg: 'image/jpeg', webp: 'image/webp' };

const refuse = (message: string) => fieldError('file', message, { message });

export interface CleanImage {
  contentType: ImageType;
  width: number;
  height: number;
  /** The image as decoded and encoded again: pixels only, no metadata, nothing appended. */
  data: Buffer;
}

/**
 * Decide what an uploaded file is from its bytes alone (its name and declared type are ignored),
 * decode it fully with libvips (sharp) and encode the pixels again in the same format. What does
 * not decode is refused; what does comes out without metadata (EXIF, XMP, ICC comments, text
 * chunks) and without anything hidden after or inside it (an HTML page or a ZIP archive behind a
 * valid header). Only PNG, JPEG and WebP pass; SVG never does (it can carry script).
 */
export async function cleanImage(buf: Buffer): Promise<CleanImage> {
  if (buf.length === 0) throw refuse('The file is empty');
  if (buf.length > MAX_LOGO_BYTES) throw refuse(`The file is larger than ${MAX_LOGO_BYTES / 1024} KB`);
  const sniffed = sniff(buf);
  if (!sniffed) throw refuse('Only PNG, JPEG or WebP images are accepted (checked by content, not by name)');
  const unreadable = () =>
    refuse('The image cannot be read: it is damaged or not what its first bytes claim');
  let meta: sharp.Metadata;
  try {
    meta = await sharp(buf, { failOn: 'warning', limitInputPixels: MAX_SIDE_PX * MAX_SIDE_PX }).metadata();
  } catch {
    throw unreadable();
  }
  if (formatTypes[meta.format ?? ''] !== sniffed) throw refuse('The image content does not match its format');
  const { width, height } = meta;
  if (!width || !height || width > MAX_SIDE_PX || height > MAX_SIDE_PX) {
    throw refuse(`Image sides must be between 1 and ${MAX_SIDE_PX} pixels`);
  }
  try {
    // rotate() applies the EXIF orientation before the metadata is dropped (sharp keeps none by default).
    const pipeline = sharp(buf, { failOn: 'warning', limitInputPixels: MAX_SIDE_PX * MAX_SIDE_PX }).rotate();
    const encoded =
      sniffed === 'image/png'
        ? pipeline.png({ compressionLevel: 9 })
        : sniffed === 'image/jpeg'
          ? pipeline.jpeg({ quality: 90 })
          : pipeline.webp({ quality: 90 });
    const { data, info } = await encoded.toBuffer({ resolveWithObject: true });
    return { contentType: sniffed, width: info.width, height: info.height, data };
  } catch {
    throw unreadable();
  }
}
