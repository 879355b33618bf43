export { createTestDatabase, type TestDatabase } from './db.js';
export {
  seedOrgWithTeam,
  snapshotTables,
  uniqueEmail,
  type FixtureOrg,
  type FixtureUser,
} from './fixtures.js';
export {
  API,
  TestClient,
  createTestApp,
  linkToken,
  mailbox,
  type KeptMessage,
  type Pending,
  type TestApp,
} from './client.js';
export { probeUrl, routeKey } from './routes.js';
export { makePng } from './images.js';
export { storedRollups, rollupsFromRaw } from '../usage/rollups.js';
