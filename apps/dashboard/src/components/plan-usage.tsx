import { allowanceShare, plans, type BillingSummary } from '@wickstone/contracts';

const count = new Intl.NumberFormat('en-GB');
const monthName = (month: string) =>
  new Intl.DateTimeFormat('en-GB', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(
    new Date(`${month}-01T00:00:00Z`),
  );

function Meter({ label, used, limit, note }: { label: string; used: number; limit: number; note?: string }) {
  const share = allowanceShare(used, limit);
  const tone = share >= 100 ? 'bg-bad' : share >= 80 ? 'bg-warn' : 'bg-accent';
  return (
    <div className="space-y-1.5">
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <span className="font-semibold">{label}</span>
        <span className="text-sm text-ink-soft">
          <strong className="text-ink">{count.format(used)}</strong> of {count.format(limit)}
        </span>
      </div>
      <div
        role="meter"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={limit}
        aria-valuenow={Math.min(used, limit)}
        aria-valuetext={`${count.format(used)} of ${count.format(limit)}`}
        className="h-2.5 overflow-hidden rounded-full bg-paper-deep"
      >
        <div className={`h-full rounded-full ${tone}`} style={{ width: `${Math.min(share, 100)}%` }} />
      </div>
      {note ? <p className="text-sm text-ink-soft">{note}</p> : null}
    </div>
  );
}

/** Use against the plan: the month's logged runs, live widgets and all widgets. */
export function PlanUsage({ summary }: { summary: BillingSummary }) {
  const limits = plans[summary.plan].limits;
  const { usage } = summary;
  const over = usage.runsOverAllowance;
  return (
    <div className="space-y-4" data-testid="plan-usage">
      <Meter
        label={`Runs logged in ${monthName(usage.month)}`}
        used={usage.runs}
        limit={limits.runsPerMonth}
        note={
          over > 0
            ? `${count.format(over)} over the allowance: stored and marked, and your widgets keep working.`
            : 'Past the allowance, runs are still stored (marked) and widgets keep working.'
        }
      />
      <Meter label="Widgets in service" used={usage.liveWidgets} limit={limits.liveWidgets} />
      <Meter label="All widgets, those in preparation included" used={usage.widgets} limit={limits.widgets} />
    </div>
  );
}
