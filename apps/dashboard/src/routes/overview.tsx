import { useQuery } from '@tanstack/react-query';
import { can, plans } from '@wickstone/contracts';
import { useOrg } from '../lib/org-context';
import { roleLabel, roleSummary } from '../lib/labels';
import { usePageTitle } from '../lib/use-page-title';
import { orgPath } from '../nav';
import { membersQuery } from '../queries/members';
import { planQuery } from '../queries/billing';
import { PlanUsage } from '../components/plan-usage';
import { HealthStatus } from '../components/health-status';
import { Card, PageHeader, Spinner, TextLink } from '../components/ui';
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
      {plan.isPending ? (
        <p role="status" className="flex items-center gap-2 text-ink-soft">
          <Spinner /> Reading the plan…
        </p>
      ) : plan.isError ? (
        <p className="text-bad">{describeError(plan.error)}</p>
      ) : (
        <PlanUsage summary={plan.data} />
      )}
    </Card>
  );
}

export function OverviewPage() {
  const { organizationName, role } = useOrg();
  usePageTitle(organizationName);
  return (
    <section className="space-y-6">
      <PageHeader title={organizationName} lead="Overview of your organisation's workspace." />
      <div className="grid gap-4 sm:grid-cols-2">
        <Card className="space-y-3 p-5">
          <h2 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">Your role</h2>
          <p className="text-3xl font-bold tracking-tight">{roleLabel[role]}</p>
          <p className="text-sm text-ink-soft">{roleSummary[role]}</p>
        </Card>
        <TeamSummary />
      </div>
      <PlanSummary />
      <Card className="flex flex-wrap items-center justify-between gap-3 px-5 py-4">
        <h2 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">Service</h2>
        <HealthStatus />
      </Card>
    </section>
  );
}
