import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import type { RunListItem, ShownValue, UsageCounts, UsageSummary } from '@wickstone/contracts';
import { formatDateTime } from '../lib/labels';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import { defaultRange, pageParam, pick, useFilterParams } from '../lib/usage-filters';
import { orgPath } from '../nav';
import { runListQuery, usageSummaryQuery } from '../queries/usage';
import { widgetListQuery } from '../queries/widgets';
import { table } from '../components/table';
import { NoSuchPage, PagedTable } from '../components/paged-table';
import { EmptyState, ErrorState, LoadingState } from '../components/states';
import { Badge, Breakable, Card, PageHeader, buttonClass } from '../components/ui';
import { FilterBar, FilterDate, FilterSelect } from '../components/filter-controls';
import { RunsPerDayChart } from '../components/usage-chart';

const pageSize = 25;
const filterNames = ['from', 'to', 'widgetId', 'calculatorId', 'origin', 'hasWarning', 'sort'] as const;
const tdClass = `${table.td} align-top text-sm`;

function change(now: number, before: number): string {
  if (before === 0) return now === 0 ? 'no change' : 'none in the period before';
  const pct = Math.round(((now - before) / before) * 100);
  return pct === 0 ? 'no change' : `${pct > 0 ? '+' : '−'}${Math.abs(pct)}% on the period before`;
}

function Totals({ summary }: { summary: UsageSummary }) {
  const items: { key: keyof UsageCounts; label: string }[] = [
    { key: 'runs', label: 'Runs' },
    { key: 'withLead', label: 'Led to a lead' },
    { key: 'withWarning', label: 'With a warning' },
    { key: 'disagreed', label: 'Not reproduced' },
  ];
  return (
    <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
      {items.map(({ key, label }) => (
        <Card key={key} className="px-4 py-3">
          <dt className="text-xs font-semibold tracking-wider text-ink-soft uppercase">{label}</dt>
          <dd className="mt-1 text-2xl font-bold tabular-nums" data-total={key}>
            {summary.totals[key]}
          </dd>
          <dd className="text-xs text-ink-soft">
            {change(summary.totals[key], summary.previous.totals[key])} ({summary.previous.totals[key]})
          </dd>
        </Card>
      ))}
    </dl>
  );
}

function Breakdown({
  title,
  rows,
}: {
  title: string;
  rows: { key: string; label: string; runs: number; withLead: number }[];
}) {
  return (
    <Card className="p-4">
      <h3 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">{title}</h3>
      {rows.length === 0 ? (
        <p className="mt-2 text-sm text-ink-soft">No runs.</p>
      ) : (
        <table className="mt-2 w-full text-sm">
          <caption className="sr-only">{title}</caption>
          <thead className="text-left text-xs text-ink-soft">
            <tr>
              <th scope="col" className="py-1 font-semibold">
                Name
              </th>
              <th scope="col" className="py-1 pl-3 text-right font-semibold">
                Runs
              </th>
              <th scope="col" className="py-1 pl-3 text-right font-semibold">
                Leads
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.key} className="border-t border-line tabular-nums">
                <th scope="row" className="py-1 pr-2 text-left font-normal">
                  <Breakable text={r.label} />
                </th>
                <td className="py-1 text-right">{r.runs}</td>
                <td className="py-1 text-right">{r.withLead}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </Card>
  );
}

function SummaryView({ summary }: { summary: UsageSummary }) {
  return (
    <div className="space-y-4">
      <Totals summary={summary} />
      <Card className="p-4">
        <h2 className="mb-2 text-lg font-bold tracking-tight">Runs per day</h2>
        <RunsPerDayChart perDay={summary.perDay} />
      </Card>
      <div className="grid gap-4 lg:grid-cols-3">
        <Breakdown
          title="By widget"
          rows={summary.byWidget.map((w) => ({ key: String(w.widgetId), label: w.name, ...w }))}
        />
        <Breakdown
          title="By calculator"
          rows={summary.byCalculator.map((c) => ({ key: c.calculatorId, label: c.title, ...c }))}
        />
        <Breakdown
          title="By site"
          rows={summary.bySite.map((s) => ({ key: s.origin, label: s.origin, ...s }))}
        />
      </div>
      <Card className="p-4">
        <h3 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">
          Warnings raised most often
        </h3>
        {summary.topWarnings.length === 0 ? (
          <p className="mt-2 text-sm text-ink-soft">No validity warning in this period.</p>
        ) : (
          <ol className="mt-2 space-y-1.5 text-sm">
            {summary.topWarnings.map((w) => (
              <li key={`${w.calculatorId}-${w.code}`} className="flex items-baseline justify-between gap-3">
                <span>
                  <Badge tone="warn">{w.code}</Badge> <span className="text-ink-soft">{w.summary}</span>
                </span>
                <span className="tabular-nums font-semibold">{w.runs}</span>
              </li>
            ))}
          </ol>
        )}
      </Card>
    </div>
  );
}

/** The first few values only (the run's own page has them all), each with the unit in its text. */
function Values({ values, shown }: { values: readonly ShownValue[]; shown: number }) {
  if (values.length === 0) return <span className="text-ink-soft">—</span>;
  const rest = values.length - shown;
  return (
    <ul className="space-y-0.5">
      {values.slice(0, shown).map((v) => (
        <li key={v.id}>
          <span className="text-ink-soft">{v.label}:</span> <span className="tabular-nums">{v.text}</span>
        </li>
      ))}
      {rest > 0 ? <li className="text-xs text-ink-faint">and {rest} more</li> : null}
    </ul>
  );
}

function RunRow({ run }: { run: RunListItem }) {
  const { orgId } = useOrg();
  return (
    <tr className={table.row} data-run-row={run.id}>
      <td className={`${tdClass} whitespace-nowrap ${table.wide}`}>
        <Link
          to={orgPath(orgId, `usage/runs/${run.id}`)}
          className="font-semibold text-brand underline decoration-brand/30 underline-offset-4 hover:decoration-brand"
        >
          <time dateTime={run.createdAt}>{formatDateTime(run.createdAt)}</time>
        </Link>
      </td>
      <td data-label="Widget" className={`${tdClass} ${table.wide} ${table.labelled}`}>
        {run.widget.name}
        <span className="block text-xs text-ink-soft">{run.calculator.title}</span>
      </td>
      <td className={`${tdClass} ${table.wide}`}>
        <Values values={run.inputs} shown={3} />
      </td>
      <td className={`${tdClass} ${table.wide}`}>
        <Values values={run.outputs} shown={2} />
      </td>
      <td className={tdClass}>
        {run.warningCodes.length ? (
          <span className="flex flex-wrap gap-1">
            {run.warningCodes.map((c) => (
              <Badge key={c} tone="warn">
                {c}
              </Badge>
            ))}
          </span>
        ) : (
          <span className="text-ink-soft">None</span>
        )}
      </td>
      <td data-label="Site" className={`${tdClass} ${table.labelled}`}>
        <Breakable text={run.origin} />
        <span className="block text-xs text-ink-soft">release {run.release}</span>
      </td>
      <td className={tdClass}>
        {run.agreed ? <Badge>Agreed</Badge> : <Badge tone="warn">Differs</Badge>}
        {run.leadId ? (
          <span className="mt-1 block">
            <Badge tone="brand">Lead</Badge>
          </span>
        ) : null}
      </td>
    </tr>
  );
}

export function UsagePage() {
  usePageTitle('Usage');
  const { orgId } = useOrg();
  const [params, set] = useFilterParams();
  const range = defaultRange();
  const from = params.get('from') ?? range.from;
  const to = params.get('to') ?? range.to;
  const page = pageParam(params);
  const sort = params.get('sort') === 'createdAt' ? 'createdAt' : '-createdAt';
  const filters = pick(params, filterNames, { from, to });
  const summary = useQuery(usageSummaryQuery(orgId, pick(params, ['from', 'to', 'widgetId'], { from, to })));
  const runs = useQuery(runListQuery(orgId, `${filters}&page=${page}&pageSize=${pageSize}`));
  const widgets = useQuery(widgetListQuery(orgId, 1, 200));
  const exportHref = `/api/v1/orgs/${orgId}/runs/export?${pick(
    params,
    filterNames.filter((n) => n !== 'sort'),
    { from, to },
  )}`;

  const widgetOptions = (widgets.data?.items ?? []).map((w) => ({ value: String(w.id), label: w.name }));
  const calculatorOptions = (summary.data?.byCalculator ?? []).map((c) => ({
    value: c.calculatorId,
    label: c.title,
  }));
  const siteOptions = (summary.data?.bySite ?? []).map((s) => ({ value: s.origin, label: s.origin }));
  const current = (name: string) => params.get(name) ?? '';
  // A chosen value that is not among this period's options still shows as chosen.
  const keep = (options: { value: string; label: string }[], name: string) =>
    current(name) && !options.some((o) => o.value === current(name))
      ? [...options, { value: current(name), label: current(name) }]
      : options;

  let summaryBody;
  if (summary.isPending) summaryBody = <LoadingState label="Counting the runs…" />;
  else if (summary.isError)
    summaryBody = (
      <ErrorState
        title="The summary could not be loaded"
        error={summary.error}
        onRetry={() => void summary.refetch()}
      />
    );
  else summaryBody = <SummaryView summary={summary.data} />;

  let runsBody;
  if (runs.isPending) runsBody = <LoadingState label="Loading the runs…" />;
  else if (runs.isError)
    runsBody = (
      <ErrorState
        title="The runs could not be loaded"
        error={runs.error}
        onRetry={() => void runs.refetch()}
      />
    );
  else if (runs.data.items.length === 0)
    runsBody =
      page > 1 ? (
        <NoSuchPage page={page} onFirst={() => set('page', '')} />
      ) : (
        <EmptyState title="No runs match these filters">
          Runs appear here as visitors use your widgets in service. Widen the dates or clear a filter.
        </EmptyState>
      );
  else {
    runsBody = (
      <div className="space-y-3">
        <p className="text-sm text-ink-soft" aria-live="polite" data-testid="runs-total">
          {runs.data.total} {runs.data.total === 1 ? 'run' : 'runs'} match
        </p>
        <PagedTable
          noun="runs"
          page={page}
          pageSize={pageSize}
          total={runs.data.total}
          onPage={(p) => set('page', p === 1 ? '' : String(p))}
          caption={`Runs, ${sort === '-createdAt' ? 'newest' : 'oldest'} first`}
          loading={runs.isPlaceholderData}
          columns={[
            { label: 'Time' },
            { label: 'Widget' },
            { label: 'Inputs' },
            { label: 'Results' },
            { label: 'Warnings' },
            { label: 'Site and release' },
            { label: 'Check' },
          ]}
        >
          {runs.data.items.map((r) => (
            <RunRow key={r.id} run={r} />
          ))}
        </PagedTable>
      </div>
    );
  }

  return (
    <section className="space-y-6">
      <PageHeader
        title="Usage"
        lead="How visitors use your widgets: what they entered, what they were shown, and which runs turned into requests for an assessment."
        actions={
          <a href={exportHref} download className={buttonClass()}>
            Download CSV
          </a>
        }
      />
      <FilterBar label="Filters">
        <FilterDate label="From" value={from} onChange={(v) => set('from', v)} />
        <FilterDate label="To" value={to} onChange={(v) => set('to', v)} />
        <FilterSelect
          label="Widget"
          value={current('widgetId')}
          options={keep(widgetOptions, 'widgetId')}
          onChange={(v) => set('widgetId', v)}
        />
        <FilterSelect
          label="Calculator"
          value={current('calculatorId')}
          options={keep(calculatorOptions, 'calculatorId')}
          onChange={(v) => set('calculatorId', v)}
        />
        <FilterSelect
          label="Site"
          value={current('origin')}
          options={keep(siteOptions, 'origin')}
          onChange={(v) => set('origin', v)}
        />
        <FilterSelect
          label="Warnings"
          value={current('hasWarning')}
          allLabel="Any"
          options={[
            { value: 'true', label: 'With a warning' },
            { value: 'false', label: 'Without a warning' },
          ]}
          onChange={(v) => set('hasWarning', v)}
        />
        <FilterSelect
          label="Order"
          value={sort === 'createdAt' ? 'createdAt' : ''}
          allLabel="Newest first"
          options={[{ value: 'createdAt', label: 'Oldest first' }]}
          onChange={(v) => set('sort', v)}
        />
      </FilterBar>
      <section aria-labelledby="usage-summary" className="space-y-3">
        <h2 id="usage-summary" className="sr-only">
          Summary of the period
        </h2>
        {summaryBody}
      </section>
      <section aria-labelledby="usage-runs" className="space-y-3">
        <h2 id="usage-runs" className="text-lg font-bold tracking-tight">
          Runs
        </h2>
        {runsBody}
      </section>
    </section>
  );
}
