// `npm run changeset:check` (and `npm test`): every change to the source of calc-core or the widget
// comes with a changeset. CI runs on a clean clone of main with no pull-request base to compare
// against, so the check reads the history itself; see "Changesets" in DEVELOPERS.md.
import { runChangesetCheck } from './lib/changesets.mjs';

process.exit(runChangesetCheck() ? 0 : 1);
