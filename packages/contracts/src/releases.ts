import { z } from 'zod';

/** A release folder's name: a semantic version without build metadata (`1.2.0`, `1.3.0-rc.1`). */
export const releaseVersionSchema = z.string().regex(/^\d+\.\d+\.\d+(?:-[0-9A-Za-z.-]+)?$/);

/** One calculator's script in a release. */
export const releaseFileSchema = z.object({
  /** A plain file name in the release folder. */
  file: z.string().regex(/^[A-Za-z0-9._-]+\.js$/),
  /** Subresource Integrity hash, `sha384-<base64>`. */
  integrity: z.string().regex(/^sha384-[A-Za-z0-9+/]+={0,2}$/),
  bytes: z.number().int().nonnegative(),
  gzipBytes: z.number().int().nonnegative(),
});

/** What the widget build writes beside each release (packages/widget/dist/releases/<version>/manifest.json). */
export const releaseManifestSchema = z.object({
  version: releaseVersionSchema,
  calcCoreVersion: z.string().min(1),
  /** By calculator id. */
  files: z.record(z.string(), releaseFileSchema),
  /** Font key to file name in the release folder. */
  fonts: z.record(z.string(), z.string().regex(/^[A-Za-z0-9._-]+$/)),
});

export type ReleaseFile = z.infer<typeof releaseFileSchema>;
export type ReleaseManifest = z.infer<typeof releaseManifestSchema>;
