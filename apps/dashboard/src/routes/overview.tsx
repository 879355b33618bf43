import { useQuery } from '@tanstack/react-query';
import { can, plans } from '@wickstone/contracts';
import { useOrg } from '../lib/org-context';
import { formatDate, roleLabel, roleSummary } from '../lib/labels';
import { utcDay } from '../lib/usage-filters';
import { leadListQuery, usageSummaryQuery } from '../queries/usage';
import { widgetListQuery } from '../queries/widgets';
import { orgRefusedOriginsQuery, releasesQuery } from '../queries/releases';
import { usePageTitle } from '../lib/use-page-title';
import { orgPath } from '../nav';
import { membersQuery } from '../queries/members';
import { planQuery } from '../queries/billing';
import { PlanUsage } from '../components/plan-usage';
import { Breakable, Card, PageHeader, Spinner, TextLink } from '../components/ui';
import { describeError } from '../components/states';

function TeamSummary() {
  const { orgId, role } = useOrg();
  const members = useQuery(membersQuery(orgId));
  let body;
  if (members.isPending) {
    body = (
      <p role="status" className="flex items-center gap-2 text-ink-soft">
        <Spinner /> Counting the team…
      </p>
    );
  } else if (members.isError) {
    body = <p className="text-bad">{describeError(members.error)}</p>;
  } else {
    const pending = members.data.invitations.length;
    body = (
      <p className="text-3xl font-bold tracking-tight">
        {members.data.items.length}
        <span className="ml-2 text-base font-semibold text-ink-soft">
          {members.data.items.length === 1 ? 'member' : 'members'}
          {pending > 0 ? ` · ${pending} invited` : ''}
        </span>
      </p>
    );
  }
  return (
    <Card className="space-y-3 p-5">
      <h2 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">Team</h2>
      {body}
      <TextLink to={orgPath(orgId, 'team')} className="text-sm">
        {can(role, 'members:manage') ? 'Invite and manage people' : 'See who is on the team'}
      </TextLink>
    </Card>
  );
}

/** Use against the plan, for every member; the owner gets the way to change it. */
function PlanSummary() {
  const { orgId, role } = useOrg();
  const plan = useQuery(planQuery(orgId));
  return (
    <Card className="space-y-4 p-5">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">
          {plan.data ? `${plans[plan.data.plan].name} plan` : 'Plan'}
        </h2>
        {can(role, 'billing:manage') ? (
          <TextLink to={orgPath(orgId, 'billing')} className="text-sm">
            Plan and billing
          </TextLink>
        ) : null}
      </div>
      {plan.isSuccess ? (
        <PlanUsage summary={plan.data} />
      ) : (
        <Waiting query={plan} label="Reading the plan…" />
      )}
    </Card>
  );
}

/** A card's body while its data is on the way, or why it did not come. */
function Waiting({ query, label }: { query: { isError: boolean; error: unknown }; label: string }) {
  if (query.isError) return <p className="text-bad">{describeError(query.error)}</p>;
  return (
    <p role="status" className="flex items-center gap-2 text-ink-soft">
      <Spinner /> {label}
    </p>
  );
}

const ruleHeading = 'text-sm font-semibold tracking-wider text-ink-soft uppercase';

/** One figure with its words, or the state of fetching it. */
function Figure({
  query,
  value,
  unit,
  testId,
}: {
  query: { isPending: boolean; isError: boolean; error: unknown };
  value: number | undefined;
  unit: (n: number) => string;
  testId: string;
}) {
  if (query.isPending || query.isError || value === undefined)
    return <Waiting query={query} label="Counting…" />;
  return (
    <p className="text-3xl font-bold tracking-tight tabular-nums">
      <span data-figure={testId}>{value}</span>
      <span className="ml-2 text-base font-semibold text-ink-soft">{unit(value)}</span>
    </p>
  );
}

/** The analyst's first question: who is waiting for a reply. */
function EnquiriesWaiting() {
  const { orgId } = useOrg();
  const waiting = useQuery(leadListQuery(orgId, 'status=new&sort=createdAt&page=1&pageSize=3'));
  return (
    <Card className="space-y-3 p-5">
      <h2 className={ruleHeading}>Enquiries awaiting a reply</h2>
      <Figure
        query={waiting}
        value={waiting.data?.total}
        unit={(n) => (n === 1 ? 'enquiry' : 'enquiries')}
        testId="enquiries-waiting"
      />
      {waiting.data && waiting.data.items.length > 0 ? (
        <ul className="space-y-1 text-sm">
          {waiting.data.items.map((l) => (
            <li key={l.id}>
              <TextLink to={orgPath(orgId, `leads/${l.id}`)}>
                {l.erasedAt ? `Enquiry ${l.id}` : (l.name ?? l.email ?? `Enquiry ${l.id}`)}
              </TextLink>{' '}
              <span className="text-ink-soft">
                via {l.widget.name}, {formatDate(l.createdAt)}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
      <TextLink to={`${orgPath(orgId, 'leads')}?status=new`} className="text-sm">
        Every enquiry awaiting a reply
      </TextLink>
    </Card>
  );
}

/** The admin's: which widgets are working on which sites, and how much they were used this week. */
function WidgetsAtWork() {
  const { orgId } = useOrg();
  const widgets = useQuery(widgetListQuery(orgId, 1, 100));
  const inService = widgets.data?.items.filter((w) => w.status === 'live') ?? [];
  const sites = new Set(inService.flatMap((w) => w.allowedOrigins));
  return (
    <Card className="space-y-3 p-5">
      <h2 className={ruleHeading}>Widgets in service</h2>
      <Figure
        query={widgets}
        value={widgets.data ? inService.length : undefined}
        unit={() => `on ${sites.size} ${sites.size === 1 ? 'site' : 'sites'}`}
        testId="widgets-in-service"
      />
      {inService.length > 0 ? (
        <ul className="space-y-1 text-sm">
          {inService.slice(0, 4).map((w) => (
            <li key={w.id}>
              <TextLink to={orgPath(orgId, `widgets/${w.id}`)}>{w.name}</TextLink>{' '}
              <span className="text-ink-soft">
                on <Breakable text={w.allowedOrigins.join(', ')} />
              </span>
            </li>
          ))}
        </ul>
      ) : null}
      <TextLink to={orgPath(orgId, 'widgets')} className="text-sm">
        All widgets
      </TextLink>
    </Card>
  );
}

function RunsThisWeek() {
  const { orgId } = useOrg();
  const from = utcDay(-6);
  const to = utcDay(0);
  const summary = useQuery(usageSummaryQuery(orgId, `from=${from}&to=${to}`));
  const totals = summary.data?.totals;
  return (
    <Card className="space-y-3 p-5">
      <h2 className={ruleHeading}>Runs in the last 7 days</h2>
      <Figure
        query={summary}
        value={totals?.runs}
        unit={(n) => (n === 1 ? 'run' : 'runs')}
        testId="runs-this-week"
      />
      {totals ? (
        <p className="text-sm text-ink-soft">
          {totals.withWarning} with a validity warning · {totals.withLead} led to an enquiry · week before:{' '}
          {summary.data?.previous.totals.runs ?? 0}
        </p>
      ) : null}
      <TextLink to={`${orgPath(orgId, 'usage')}?from=${from}&to=${to}`} className="text-sm">
        Usage for these days
      </TextLink>
    </Card>
  );
}

/** The newest published release, for saying which widgets could move. */
function newestPublished(items: { version: string; published: boolean }[] | undefined): string | null {
  return items?.find((r) => r.published)?.version ?? null;
}

/** The developer's: which release each widget runs, and whether a newer published one is ready. */
function ReleasesInUse() {
  const { orgId } = useOrg();
  const widgets = useQuery(widgetListQuery(orgId, 1, 100));
  const releases = useQuery(releasesQuery());
  const newest = newestPublished(releases.data?.items);
  const byRelease = new Map<string, string[]>();
  for (const w of widgets.data?.items ?? [])
    byRelease.set(w.release, [...(byRelease.get(w.release) ?? []), w.name]);
  return (
    <Card className="space-y-3 p-5">
      <h2 className={ruleHeading}>Releases in use</h2>
      {!widgets.isSuccess ? (
        <Waiting query={widgets} label="Reading the widgets…" />
      ) : byRelease.size === 0 ? (
        <p className="text-sm text-ink-soft">No widget yet.</p>
      ) : (
        <ul className="space-y-1 text-sm" data-releases-in-use>
          {[...byRelease].map(([release, names]) => (
            <li key={release}>
              <span className="font-semibold tabular-nums">Release {release}</span>{' '}
              <span className="text-ink-soft">
                · {names.length} {names.length === 1 ? 'widget' : 'widgets'}: {names.join(', ')}
              </span>
              {newest &&
              release !== newest &&
              releases.data?.items.some((r) => r.version === release && r.published) ? (
                <span className="block text-ink-soft" data-release-status="behind">
                  Published {newest} is newer: preview it on the widget&rsquo;s page before moving the pin.
                </span>
              ) : release === newest ? (
                <span className="block text-ink-soft" data-release-status="newest">
                  The newest published release.
                </span>
              ) : releases.isSuccess &&
                !releases.data.items.some((r) => r.version === release && r.published) ? (
                <span className="block text-ink-soft" data-release-status="unpublished">
                  Not published yet: this server&rsquo;s own build.
                </span>
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

/**
 * The developer's: pages the embed API refused because their site is not allowed, per origin over
 * the last 30 days, across the organisation's widgets, most refused first.
 */
function RefusedOrigins() {
  const { orgId } = useOrg();
  const refused = useQuery(orgRefusedOriginsQuery(orgId));
  const sorted = refused.data?.items ?? [];
  return (
    <Card className="space-y-3 p-5" data-slot="refused-origins">
      <h2 className={ruleHeading}>Sites refused, last 30 days</h2>
      {!refused.isSuccess ? (
        <Waiting query={refused} label="Counting refused pages…" />
      ) : sorted.length === 0 ? (
        <p className="text-sm text-ink-soft">No page outside the allowed sites asked for a widget.</p>
      ) : (
        <ul className="space-y-2 text-sm" data-refused-summary>
          {sorted.slice(0, 6).map((r) => (
            <li key={r.origin}>
              <Breakable text={r.origin} />{' '}
              <span className="font-semibold tabular-nums">
                {r.refusals} {r.refusals === 1 ? 'refusal' : 'refusals'}
              </span>
              <span className="block text-ink-soft">
                {r.widgets.map((w, i) => (
                  <span key={w.id}>
                    {i ? ', ' : ''}
                    <TextLink to={`${orgPath(orgId, `widgets/${w.id}`)}#widget-release`}>{w.name}</TextLink>
                    {r.widgets.length > 1 && <span className="tabular-nums"> ({w.refusals})</span>}
                  </span>
                ))}
              </span>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

export function OverviewPage() {
  const { organizationName, role } = useOrg();
  usePageTitle(organizationName);
  const analystWork = can(role, 'leads:read');
  const adminWork = can(role, 'widgets:write');
  const developerWork = role === 'developer';
  return (
    <section className="space-y-6">
      <PageHeader title={organizationName} lead={`${roleLabel[role]} · ${roleSummary[role]}`} />
      <div className="grid gap-4 sm:grid-cols-2">
        {analystWork ? <EnquiriesWaiting /> : null}
        {adminWork ? <WidgetsAtWork /> : null}
        {adminWork || role === 'analyst' ? <RunsThisWeek /> : null}
        {developerWork ? <ReleasesInUse /> : null}
        {developerWork ? <RefusedOrigins /> : null}
        <TeamSummary />
      </div>
      <PlanSummary />
    </section>
  );
}
