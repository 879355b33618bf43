import * as createOrganizations from './20261201000000-create-organizations.js';

/**
 * Every migration, in order, listed explicitly so the same list runs from the TypeScript sources
 * (tests) and from the build (start), with no file globbing. Names are timestamp-first.
 */
export const migrations = [{ name: '20261201000000-create-organizations', ...createOrganizations }];
