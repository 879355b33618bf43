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

/** One changelog entry of a published release: a Changesets entry, by its file name. */
export const changelogEntrySchema = z.object({
  id: z.string(),
  /** Package name to bump (`major`, `minor`, `patch`, `none`). */
  packages: z.record(z.string(), z.string()),
  summary: z.string(),
});
export type ChangelogEntry = z.infer<typeof changelogEntrySchema>;

/** `release.json`, written beside a published release's files by `npm run release:publish`. */
export const publishedReleaseSchema = z.object({
  version: releaseVersionSchema,
  /** calc-core's version inside the release's engine. */
  engineVersion: z.string().min(1),
  publishedAt: z.iso.datetime(),
  /** The engine module's file name in the release folder. */
  engine: z.string().regex(/^[A-Za-z0-9._-]+\.mjs$/),
  changelog: z.array(changelogEntrySchema),
});
export type PublishedRelease = z.infer<typeof publishedReleaseSchema>;

/** `GET /api/v1/releases`: every release the server has, newest first. */
export const releaseSummarySchema = z.object({
  version: z.string(),
  engineVersion: z.string(),
  /** False for the development build of a version not published yet. */
  published: z.boolean(),
  publishedAt: z.string().nullable(),
  prerelease: z.boolean(),
  calculators: z.array(z.string()),
  changelog: z.array(changelogEntrySchema),
});
export type ReleaseSummary = z.infer<typeof releaseSummarySchema>;
export const releaseListSchema = z.object({ items: z.array(releaseSummarySchema) });

/**
 * A widget's release pin: an exact version (`0.1.0`, `1.0.0-rc.1`) or a minor line (`~0.2`: its
 * newest published patch, never a pre-release).
 */
export const releasePinSchema = z
  .string()
  .trim()
  .max(40)
  .regex(
    /^(?:\d+\.\d+\.\d+(?:-[0-9A-Za-z.-]+)?|~\d+\.\d+)$/,
    'An exact version (0.1.0) or a minor line (~0.2)',
  );
export const setReleasePinBodySchema = z.strictObject({ pin: releasePinSchema });
export type SetReleasePinBody = z.infer<typeof setReleasePinBodySchema>;

/** `to`: the candidate release; the newest release the server has when left out. */
export const upgradePreviewQuerySchema = z.strictObject({ to: releaseVersionSchema.optional() });

/** One output's changes between two engines over a widget's logged runs. */
export const upgradeOutputChangeSchema = z.object({
  id: z.string(),
  label: z.string(),
  /** Runs whose value of this output differs (a value that appears or is withheld counts). */
  runsChanged: z.number().int(),
  /** Largest |new - old| / |old| among runs with both values and old ≠ 0; null when none. */
  largestRelativeChange: z.number().nullable(),
  /** Runs where the value was shown before and is withheld now, and the other way. */
  withheldNow: z.number().int(),
  shownNow: z.number().int(),
});
export const upgradeWarningChangeSchema = z.object({
  code: z.string(),
  appearsIn: z.number().int(),
  disappearsFrom: z.number().int(),
});
export const upgradeRunChangeSchema = z.object({
  runId: z.string(),
  createdAt: z.string(),
  /** The largest relative change among this run's outputs (Infinity-free: a value appearing or withheld counts as 1). */
  largestRelativeChange: z.number(),
  outputs: z.array(z.object({ id: z.string(), from: z.number().nullable(), to: z.number().nullable() })),
  warningsAdded: z.array(z.string()),
  warningsRemoved: z.array(z.string()),
});
export const upgradePreviewSchema = z.object({
  from: z.object({ version: z.string(), engineVersion: z.string() }),
  to: z.object({ version: z.string(), engineVersion: z.string() }),
  /** Runs re-run (the widget's latest, up to `limit`). */
  runs: z.number().int(),
  limit: z.number().int(),
  /** Runs the new engine refused (inputs it no longer accepts). */
  refused: z.number().int(),
  runsChanged: z.number().int(),
  outputs: z.array(upgradeOutputChangeSchema),
  warnings: z.array(upgradeWarningChangeSchema),
  /** The runs that change most, largest first (at most 20). */
  topRuns: z.array(upgradeRunChangeSchema),
  /**
   * Where the current engine's answers come from: `recorded`, the runs whose stored server result
   * was computed at ingest by this very engine version (that result is its answer, so it is not
   * computed again); `rerun`, the runs it is run for (made on another release, or no stored result).
   */
  fromSide: z.object({ recorded: z.number().int(), rerun: z.number().int() }),
  /** Distinct stored inputs the candidate engine ran (each once, however many runs share it). */
  distinctInputs: z.number().int(),
  /** Engine time: the current engine's re-runs plus the candidate engine's runs, in ms. */
  engineMs: z.number(),
  /** Time reading the runs from the database, in ms. */
  readMs: z.number(),
  /** How the preview was made, in a sentence for the reader. */
  note: z.string(),
});
export type UpgradePreview = z.infer<typeof upgradePreviewSchema>;
