export { createTestDatabase, testDatabaseName, type TestDatabase } from './db.js';
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
export { makePng, makeZip } from './images.js';
export { CARD_DECLINED, CARD_OK, FakePayments, startBillingApp, type BillingTestApp } from './payments.js';
export { createLiveWidget, runReportBody } from './embed.js';
export { storedRollups, rollupsFromRaw } from '../src/usage/rollups.js';
export { liveWidget, runAt, store, type FixtureWidget } from './usage.js';
export { readCsv } from './csv.js';
export { publishTestReleases, TEST_ENGINE_CHANGE, type TestReleases } from './releases.js';
