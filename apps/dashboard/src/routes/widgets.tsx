import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { getCalculator } from '@wickstone/calc-core';
import { can, type Widget } from '@wickstone/contracts';
import { formatDate } from '../lib/labels';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import { usePageParam } from '../lib/usage-filters';
import { orgPath } from '../nav';
import { widgetListQuery } from '../queries/widgets';
import { table } from '../components/table';
import { NoSuchPage, PagedTable } from '../components/paged-table';
import { EmptyState, ErrorState, LoadingState } from '../components/states';
import { Breakable, ButtonLink, PageHeader } from '../components/ui';
import { StatusBadge } from '../components/widget-status';

const pageSize = 25;
const tdClass = `${table.td} align-top text-sm`;

function Sites({ widget }: { widget: Widget }) {
  const [first, ...rest] = widget.allowedOrigins;
  if (!first) return <span className="text-ink-soft">None yet</span>;
  return (
    <span>
      <Breakable text={first} />
      {rest.length ? <span className="text-ink-soft"> and {rest.length} more</span> : null}
    </span>
  );
}

function WidgetRow({ widget }: { widget: Widget }) {
  const { orgId } = useOrg();
  return (
    <tr className={table.row} data-widget-row={widget.id}>
      <td className={`${tdClass} ${table.wide}`}>
        <Link
          to={orgPath(orgId, `widgets/${widget.id}`)}
          className="font-semibold text-brand underline decoration-brand/30 underline-offset-4 hover:decoration-brand"
        >
          {widget.name}
        </Link>
      </td>
      <td data-label="Calculator" className={`${tdClass} ${table.wide} ${table.labelled}`}>
        {getCalculator(widget.calculatorId)?.title ?? widget.calculatorId}
      </td>
      <td className={tdClass}>
        <StatusBadge status={widget.status} />
      </td>
      <td className={`${tdClass} whitespace-nowrap text-ink-soft`}>
        <span className="sm:hidden">Updated </span>
        <time dateTime={widget.updatedAt}>{formatDate(widget.updatedAt)}</time>
      </td>
      <td data-label="Sites" className={`${tdClass} ${table.wide} ${table.labelled}`}>
        <Sites widget={widget} />
      </td>
    </tr>
  );
}

export function WidgetsPage() {
  usePageTitle('Widgets');
  const { orgId, role } = useOrg();
  const writer = can(role, 'widgets:write');
  const [page, goTo] = usePageParam();
  const list = useQuery(widgetListQuery(orgId, page, pageSize));
  const create = (
    <ButtonLink to={orgPath(orgId, 'widgets/new')} tone="primary">
      New widget
    </ButtonLink>
  );

  let body;
  if (list.isPending) body = <LoadingState label="Loading the widgets…" />;
  else if (list.isError)
    body = (
      <ErrorState
        title="The widgets could not be loaded"
        error={list.error}
        onRetry={() => void list.refetch()}
      />
    );
  else if (list.data.items.length === 0)
    body =
      page > 1 ? (
        <NoSuchPage page={page} onFirst={() => goTo(1)} />
      ) : (
        <EmptyState title="No widgets yet">
          {writer ? (
            <div className="space-y-3">
              <p>
                Pick one of the six calculators, give it a name, then brand it and choose where it may appear.
              </p>
              <ButtonLink to={orgPath(orgId, 'widgets/new')} tone="primary">
                Make a widget from a calculator
              </ButtonLink>
            </div>
          ) : (
            'Owners and admins make widgets; they are listed here once made.'
          )}
        </EmptyState>
      );
  else {
    body = (
      <PagedTable
        noun="widgets"
        page={page}
        pageSize={pageSize}
        total={list.data.total}
        loading={list.isPlaceholderData}
        onPage={goTo}
        caption="Widgets, most recently changed first"
        columns={[
          { label: 'Widget' },
          { label: 'Calculator' },
          { label: 'Status' },
          { label: 'Updated' },
          { label: 'Sites' },
        ]}
      >
        {list.data.items.map((w) => (
          <WidgetRow key={w.id} widget={w} />
        ))}
      </PagedTable>
    );
  }

  return (
    <section className="space-y-6">
      <PageHeader
        title="Widgets"
        lead="The calculators your firm publishes on its own sites. Each is placed by one script tag and keeps its settings here."
        actions={writer && list.data && list.data.total > 0 ? create : undefined}
      />
      {body}
    </section>
  );
}
