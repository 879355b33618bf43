import * as createOrganizations from './20261201000000-create-organizations.js';
import * as createAccounts from './20261202000000-create-accounts.js';
import * as createAuditEvents from './20261202000100-create-audit-events.js';
import * as createWidgets from './20261202010000-create-widgets.js';
import * as createRunsAndLeads from './20261202010100-create-runs-and-leads.js';
import * as usageRollupsAndRetention from './20261202020600-usage-rollups-and-retention.js';
import * as runsClusteredByTime from './20261202100000-runs-clustered-by-time.js';
import * as leadsByRunAndOrganisation from './20261202100100-leads-by-run-and-organisation.js';
import * as createRateLimitCounters from './20261202110000-create-rate-limit-counters.js';
import * as billing from './20261202120000-billing.js';
import * as leadNotes from './20261202130000-lead-notes.js';
import * as widgetReleasePins from './20261202150000-widget-release-pins.js';
import * as refusedOrigins from './20261202150100-refused-origins.js';
import * as runsSheetProject from './20261202180000-runs-sheet-project.js';
import * as runsWithoutWorking from './20261202190100-runs-without-working.js';
import * as widgetKeyRotation from './20261202190000-widget-key-rotation.js';

/**
 * Every migration, in order, listed explicitly so the same list runs from the TypeScript sources
 * (tests) and from the build (start), with no file globbing. Names are timestamp-first.
 */
export const migrations = [
  { name: '20261201000000-create-organizations', ...createOrganizations },
  { name: '20261202000000-create-accounts', ...createAccounts },
  { name: '20261202000100-create-audit-events', ...createAuditEvents },
  { name: '20261202010000-create-widgets', ...createWidgets },
  { name: '20261202010100-create-runs-and-leads', ...createRunsAndLeads },
  { name: '20261202020600-usage-rollups-and-retention', ...usageRollupsAndRetention },
  { name: '20261202100000-runs-clustered-by-time', ...runsClusteredByTime },
  { name: '20261202100100-leads-by-run-and-organisation', ...leadsByRunAndOrganisation },
  { name: '20261202110000-create-rate-limit-counters', ...createRateLimitCounters },
  { name: '20261202120000-billing', ...billing },
  { name: '20261202130000-lead-notes', ...leadNotes },
  { name: '20261202150000-widget-release-pins', ...widgetReleasePins },
  { name: '20261202150100-refused-origins', ...refusedOrigins },
  { name: '20261202180000-runs-sheet-project', ...runsSheetProject },
  { name: '20261202190000-widget-key-rotation', ...widgetKeyRotation },
  { name: '20261202190100-runs-without-working', ...runsWithoutWorking },
];
