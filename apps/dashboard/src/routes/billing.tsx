import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router';
import {
  paidPlanIds,
  planIds,
  plans,
  type BillingInvoice,
  type BillingSummary,
  type PaidPlanId,
  type Plan,
  type PlanId,
} from '@wickstone/contracts';
import { formatDate } from '../lib/labels';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import {
  invoicesQuery,
  planQuery,
  useCancelPlan,
  useChangePlan,
  useCheckout,
  useResumePlan,
} from '../queries/billing';
import { ConfirmAction } from '../components/confirm';
import { PlanUsage } from '../components/plan-usage';
import { DataTable, table } from '../components/table';
import { EmptyState, ErrorState, LoadingState, describeError } from '../components/states';
import { Badge, Button, Card, LiveMessage, Notice, PageHeader } from '../components/ui';

const pounds = (pence: number) =>
  new Intl.NumberFormat('en-GB', { style: 'currency', currency: 'GBP' }).format(pence / 100);
const count = new Intl.NumberFormat('en-GB');

function features(p: Plan): string[] {
  const l = p.limits;
  return [
    `${l.liveWidgets} ${l.liveWidgets === 1 ? 'widget' : 'widgets'} in service (${l.widgets} in all)`,
    `${count.format(l.runsPerMonth)} logged runs a month`,
    l.sheets ? 'Calculation sheets' : 'No calculation sheets',
    l.shippedFonts ? 'Your brand font in the widget' : "The visitor's system font",
    `Runs and leads kept up to ${l.retentionMonths >= 24 ? `${l.retentionMonths / 12} years` : `${l.retentionMonths} months`}`,
  ];
}

function Standing({ summary }: { summary: BillingSummary }) {
  const end = summary.currentPeriodEnd ? formatDate(summary.currentPeriodEnd) : null;
  switch (summary.state) {
    case 'grace':
      return (
        <Notice tone="warn">
          The last payment for the {plans[summary.subscribedPlan].name} plan failed. Everything keeps working
          while the card is tried again
          {summary.nextPaymentAttempt ? ` on ${formatDate(summary.nextPaymentAttempt)}` : ''}; if that fails
          too, the {plans.bench.name} plan&apos;s limits apply.
        </Notice>
      );
    case 'lapsed':
      return (
        <Notice tone="bad">
          Payment for the {plans[summary.subscribedPlan].name} plan did not go through, so the{' '}
          {plans.bench.name} plan&apos;s limits apply. Widgets in service keep working; no more can be put in
          service until the firm pays again.
        </Notice>
      );
    case 'ending':
      return (
        <Notice tone="warn">
          The {plans[summary.plan].name} plan ends on {end}; after that the {plans.bench.name} plan&apos;s
          limits apply.
        </Notice>
      );
    case 'active':
      return <Notice tone="ok">Paid. The next renewal is on {end}.</Notice>;
    default:
      return <Notice>The free {plans.bench.name} plan. Pay for a larger plan below.</Notice>;
  }
}

function PlanCard({
  plan,
  summary,
  onAnnounce,
}: {
  plan: Plan;
  summary: BillingSummary;
  onAnnounce: (message: string, tone?: 'ok' | 'bad') => void;
}) {
  const { orgId } = useOrg();
  const checkout = useCheckout(orgId);
  const change = useChangePlan(orgId);
  const cancel = useCancelPlan(orgId);
  const resume = useResumePlan(orgId);
  const current = summary.plan === plan.id && summary.state !== 'lapsed';
  const paying = ['active', 'grace', 'ending'].includes(summary.state);
  const error = checkout.error ?? change.error ?? cancel.error ?? resume.error;

  let action = null;
  if (current && summary.state === 'ending') {
    action = (
      <Button
        tone="primary"
        busy={resume.isPending}
        onClick={() =>
          resume.mutate(undefined, {
            onSuccess: () => onAnnounce(`The ${plan.name} plan continues.`),
          })
        }
      >
        Keep {plan.name}
      </Button>
    );
  } else if (current) {
    action = <Badge tone="brand">Current plan</Badge>;
  } else if (plan.id === 'bench') {
    action =
      paying && summary.state !== 'ending' ? (
        <ConfirmAction
          label={`Move to ${plan.name}`}
          question={`End the ${plans[summary.plan].name} plan when the paid month runs out?`}
          confirmLabel="End at the period's end"
          busy={cancel.isPending}
          onConfirm={() =>
            cancel.mutate(undefined, {
              onSuccess: () =>
                onAnnounce(`The ${plans[summary.plan].name} plan will end at the period's end.`),
            })
          }
        />
      ) : null;
  } else if (paying) {
    action = (
      <Button
        tone="primary"
        busy={change.isPending}
        onClick={() =>
          change.mutate(plan.id as PaidPlanId, {
            onSuccess: (s) =>
              onAnnounce(`Now on the ${plans[s.plan].name} plan; the difference is prorated on an invoice.`),
          })
        }
      >
        Move to {plan.name}
      </Button>
    );
  } else {
    action = (
      <Button
        tone="primary"
        busy={checkout.isPending}
        onClick={() =>
          checkout.mutate(plan.id as PaidPlanId, {
            onSuccess: ({ url }) => window.location.assign(url),
          })
        }
      >
        Pay for {plan.name}
      </Button>
    );
  }

  return (
    <Card className={`flex flex-col gap-3 p-5 ${current ? 'border-brand ring-1 ring-brand/40' : ''}`}>
      <div>
        <h3 className="text-lg font-bold">{plan.name}</h3>
        <p className="text-sm text-ink-soft">{plan.summary}</p>
      </div>
      <p className="text-2xl font-bold tracking-tight">
        {plan.monthlyPence === 0 ? 'Free' : pounds(plan.monthlyPence)}
        {plan.monthlyPence ? <span className="ml-1 text-sm font-semibold text-ink-soft">a month</span> : null}
      </p>
      <ul className="flex-1 list-disc space-y-1 pl-5 text-sm">
        {features(plan).map((f) => (
          <li key={f}>{f}</li>
        ))}
      </ul>
      <div className="flex flex-wrap items-center gap-2">{action}</div>
      {error ? (
        <p role="alert" className="text-sm text-bad">
          {describeError(error)}
        </p>
      ) : null}
    </Card>
  );
}

function Invoices() {
  const { orgId } = useOrg();
  const invoices = useQuery(invoicesQuery(orgId));
  if (invoices.isPending) return <LoadingState label="Fetching invoices…" />;
  if (invoices.isError)
    return (
      <ErrorState
        title="Invoices could not be fetched"
        error={invoices.error}
        onRetry={() => void invoices.refetch()}
      />
    );
  if (invoices.data.items.length === 0)
    return (
      <EmptyState title="No invoices yet">Invoices appear here once the firm pays for a plan.</EmptyState>
    );
  return (
    <DataTable
      caption="Invoices, newest first"
      columns={[
        { label: 'Invoice' },
        { label: 'Issued' },
        { label: 'Period' },
        { label: 'Amount' },
        { label: 'Status' },
      ]}
    >
      {invoices.data.items.map((i: BillingInvoice) => (
        <tr key={i.id} className={table.row}>
          <td className={`${table.td} ${table.wide}`}>
            {i.url ? (
              <a
                href={i.url}
                target="_blank"
                rel="noreferrer"
                className="font-semibold text-brand underline underline-offset-4"
              >
                {i.number ?? i.id}
              </a>
            ) : (
              (i.number ?? i.id)
            )}
          </td>
          <td className={`${table.td} ${table.labelled}`} data-label="Issued:">
            {formatDate(i.createdAt)}
          </td>
          <td className={`${table.td} ${table.labelled}`} data-label="Period:">
            {i.periodStart && i.periodEnd ? `${formatDate(i.periodStart)} – ${formatDate(i.periodEnd)}` : '—'}
          </td>
          <td className={`${table.td} ${table.labelled} tabular-nums`} data-label="Amount:">
            {pounds(i.totalPence)}
          </td>
          <td className={`${table.td} ${table.labelled}`} data-label="Status:">
            <Badge tone={i.status === 'paid' ? 'neutral' : 'warn'}>
              {i.status === 'paid' ? 'Paid' : i.status === 'open' ? 'Unpaid' : i.status}
            </Badge>
          </td>
        </tr>
      ))}
    </DataTable>
  );
}

export function BillingPage() {
  usePageTitle('Plan and billing');
  const { orgId } = useOrg();
  const summary = useQuery(planQuery(orgId));
  const [search] = useSearchParams();
  const [message, setMessage] = useState<{ text: string; tone: 'ok' | 'bad' } | null>(null);
  const returned = search.get('checkout');
  const announce = (text: string, tone: 'ok' | 'bad' = 'ok') => setMessage({ text, tone });

  let body;
  if (summary.isPending) body = <LoadingState label="Reading the plan…" />;
  else if (summary.isError)
    body = (
      <ErrorState
        title="The plan could not be read"
        error={summary.error}
        onRetry={() => void summary.refetch()}
      />
    );
  else {
    const s = summary.data;
    body = (
      <>
        {returned === 'cancelled' ? <Notice>No payment was taken.</Notice> : null}
        {returned && returned !== 'cancelled' && s.state === 'none' ? (
          <Notice tone="warn">
            The payment is being confirmed by the provider; this page updates when it is.
          </Notice>
        ) : null}
        <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
          <Card className="space-y-4 p-5">
            <h2 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">Your plan</h2>
            <p className="text-3xl font-bold tracking-tight" data-testid="current-plan">
              {plans[s.plan].name}
              <span className="ml-2 text-base font-semibold text-ink-soft">plan</span>
            </p>
            <Standing summary={s} />
          </Card>
          <Card className="p-5">
            <PlanUsage summary={s} />
          </Card>
        </div>
        <section aria-labelledby="plans-title" className="space-y-3">
          <h2 id="plans-title" className="text-lg font-bold">
            Plans
          </h2>
          <div className="grid gap-4 md:grid-cols-3">
            {planIds.map((id: PlanId) => (
              <PlanCard key={id} plan={plans[id]} summary={s} onAnnounce={announce} />
            ))}
          </div>
          <p className="text-sm text-ink-soft">
            Moving between {paidPlanIds.map((id) => plans[id].name).join(' and ')} is prorated by the payments
            provider: the unused part of this month is credited and the rest charged at the new price.
          </p>
        </section>
        <section aria-labelledby="invoices-title" className="space-y-3">
          <h2 id="invoices-title" className="text-lg font-bold">
            Invoices
          </h2>
          <Invoices />
        </section>
      </>
    );
  }
  return (
    <section className="space-y-6">
      <PageHeader
        title="Plan and billing"
        lead="What the firm pays for, what it uses, and its invoices. Only owners see this page."
      />
      <LiveMessage message={message?.text ?? null} tone={message?.tone} />
      {body}
    </section>
  );
}
