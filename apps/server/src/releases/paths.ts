import { fileURLToPath } from 'node:url';

/** Where the widget build writes its releases, relative to this package (src/ and dist/ alike). */
export const defaultReleasesDir = fileURLToPath(
  new URL('../../../../packages/widget/dist/releases', import.meta.url),
);

/** Where published releases are committed: `releases/` at the repository's root. */
export const defaultPublishedReleasesDir = fileURLToPath(new URL('../../../../releases', import.meta.url));

/** The release folders a configuration names, defaults filled in. */
export function releaseDirsOf(config: { releasesDir?: string | undefined; publishedReleasesDir?: string | undefined }): {
  build: string;
  published: string;
} {
  return {
    build: config.releasesDir ?? defaultReleasesDir,
    published: config.publishedReleasesDir ?? defaultPublishedReleasesDir,
  };
}
