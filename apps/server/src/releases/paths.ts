import { fileURLToPath } from 'node:url';

/** Where the widget build writes its releases, relative to this package (src/ and dist/ alike). */
export const defaultReleasesDir = fileURLToPath(
  new URL('../../../../packages/widget/dist/releases', import.meta.url),
);
