import { z } from 'zod';

/**
 * Bidirectional embedding/override (U+202A–U+202E) and isolate (U+2066–U+2069) controls. In a
 * display name they reorder what is shown after them (a name can make a file or address read
 * backwards), so names refuse them: common practice for display names (Unicode TR #36, section 2.1,
 * "Bidirectional text spoofing").
 */
export const BIDI_CONTROLS = /[\u202A-\u202E\u2066-\u2069]/;

/** A name people read: trimmed, 1..max characters (`min` for organisations), no bidi controls. */
export const displayNameSchema = (max: number, min = 1) =>
  z
    .string()
    .trim()
    .min(min, min === 1 ? 'Required' : `At least ${min} characters`)
    .max(max, `At most ${max} characters`)
    .refine((s) => !BIDI_CONTROLS.test(s), 'Remove the text-direction control characters');

/** An address of a web page: http or https only (never javascript:, data:, file: ...). */
export const webUrlSchema = z.url({
  protocol: /^https?$/,
  error: 'Enter a web address starting with http:// or https://',
});
