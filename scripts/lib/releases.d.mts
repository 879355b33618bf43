export const CHECKSUMS_FILE: string;
export const ENGINE_FILE: string;
export const RELEASE_FILE: string;
export const CHANGELOG_FILE: string;
export const defaults: {
  releasesDir: string;
  buildDir: string;
  widgetPackage: string;
  calcCoreEntry: string;
  changesetDir: string;
};
export interface ChangelogEntry {
  id: string;
  packages: Record<string, string>;
  summary: string;
}
export interface ReleaseInfo {
  version: string;
  engineVersion: string;
  publishedAt: string;
  engine: string;
  changelog: ChangelogEntry[];
}
export function checksumList(dir: string): string;
export function verifyRelease(dir: string): string[];
export function publishedVersions(releasesDir: string): string[];
export function newChangesets(changesetDir: string, releasesDir: string): ChangelogEntry[];
export function bundleEngine(entry: string, outFile: string): Promise<void>;
export function publishRelease(
  options?: Partial<typeof defaults> & { version?: string; now?: Date },
): Promise<{ version: string; dir: string; info: ReleaseInfo }>;
