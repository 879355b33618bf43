import type { WidgetStatus } from './widgets.js';
import type { LeadStatus } from './usage.js';

/*
 * The words people read for stored status codes. The codes stay as they are in the database, the
 * API, URLs and the audit record (they are data, like a warning's code); every screen, export and
 * e-mail shows these words instead. Written once here so the dashboard and the server's exports agree.
 */

/** A widget's standing, in the words of a firm's own site work. */
export const widgetStatusWords: Record<WidgetStatus, string> = {
  draft: 'In preparation',
  live: 'In service',
  paused: 'On hold',
};

/** Where an enquiry stands, in the order a consultancy works one. */
export const leadStatusWords: Record<LeadStatus, string> = {
  new: 'Awaiting reply',
  contacted: 'Replied',
  qualified: 'Visit proposed',
  closed: 'Filed',
};
