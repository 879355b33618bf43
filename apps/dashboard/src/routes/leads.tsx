import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import type { Lead } from '@wickstone/contracts';
import { formatDateTime } from '../lib/labels';
import { leadStatusLabel, leadStatusOptions } from '../lib/lead-labels';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import { pageParam, pick, useFilterParams } from '../lib/usage-filters';
import { orgPath } from '../nav';
import { membersQuery } from '../queries/members';
import { leadListQuery } from '../queries/usage';
import { widgetListQuery } from '../queries/widgets';
import { table } from '../components/table';
import { NoSuchPage, PagedTable } from '../components/paged-table';
import { EmptyState, ErrorState, LoadingState } from '../components/states';
import { Badge, Breakable, PageHeader, buttonClass } from '../components/ui';
import { FilterBar, FilterSelect, FilterSearch } from '../components/filter-controls';

const pageSize = 25;
const filterNames = ['status', 'widgetId', 'assigneeId', 'q'] as const;
const tdClass = `${table.td} align-top text-sm`;

export function LeadStatusBadge({ lead }: { lead: Pick<Lead, 'status' | 'erasedAt'> }) {
  if (lead.erasedAt) return <Badge>Erased</Badge>;
  return <Badge tone={lead.status === 'new' ? 'brand' : 'neutral'}>{leadStatusLabel[lead.status]}</Badge>;
}

function LeadRow({ lead }: { lead: Lead }) {
  const { orgId } = useOrg();
  return (
    <tr className={table.row} data-lead-row={lead.id}>
      <td className={tdClass}>
        <LeadStatusBadge lead={lead} />
      </td>
      <td className={`${tdClass} ${table.wide}`}>
        <Link
          to={orgPath(orgId, `leads/${lead.id}`)}
          className="font-semibold text-brand underline decoration-brand/30 underline-offset-4 hover:decoration-brand"
        >
          {lead.erasedAt ? 'Personal data erased' : (lead.name ?? lead.email ?? `Enquiry ${lead.id}`)}
        </Link>
        {!lead.erasedAt ? (
          <span className="block text-xs text-ink-soft">
            <Breakable text={[lead.email, lead.company].filter(Boolean).join(' · ')} />
          </span>
        ) : null}
      </td>
      <td data-label="Widget" className={`${tdClass} ${table.labelled}`}>
        {lead.widget.name}
      </td>
      <td data-label="Site" className={`${tdClass} ${table.wide} ${table.labelled}`}>
        {lead.siteAddress ?? <span className="text-ink-soft">Not given</span>}
      </td>
      <td data-label="Assignee" className={`${tdClass} ${table.labelled}`}>
        {lead.assignee?.name ?? <span className="text-ink-soft">Nobody</span>}
      </td>
      <td className={`${tdClass} whitespace-nowrap text-ink-soft`}>
        <time dateTime={lead.createdAt}>{formatDateTime(lead.createdAt)}</time>
      </td>
    </tr>
  );
}

export function LeadsPage() {
  usePageTitle('Enquiries');
  const { orgId } = useOrg();
  const [params, set] = useFilterParams();
  const page = pageParam(params);
  const filters = pick(params, filterNames);
  const leads = useQuery(
    leadListQuery(orgId, `${filters}${filters ? '&' : ''}page=${page}&pageSize=${pageSize}`),
  );
  const widgets = useQuery(widgetListQuery(orgId, 1, 200));
  const members = useQuery(membersQuery(orgId));
  const current = (name: string) => params.get(name) ?? '';
  const filtered = filters !== '';

  let body;
  if (leads.isPending) body = <LoadingState label="Loading the enquiries…" />;
  else if (leads.isError)
    body = (
      <ErrorState
        title="The enquiries could not be loaded"
        error={leads.error}
        onRetry={() => void leads.refetch()}
      />
    );
  else if (leads.data.items.length === 0)
    body =
      page > 1 ? (
        <NoSuchPage page={page} onFirst={() => set('page', '')} />
      ) : (
        <EmptyState title={filtered ? 'No enquiry matches these filters' : 'No enquiries yet'}>
          {filtered
            ? 'Clear a filter to see more.'
            : 'When a visitor asks for a site assessment from one of your widgets, the request lands here and the firm is e-mailed.'}
        </EmptyState>
      );
  else {
    body = (
      <div className="space-y-3">
        <PagedTable
          noun="enquiries"
          page={page}
          pageSize={pageSize}
          total={leads.data.total}
          onPage={(p) => set('page', p === 1 ? '' : String(p))}
          caption="Enquiries, newest first"
          loading={leads.isPlaceholderData}
          columns={[
            { label: 'Status' },
            { label: 'Who' },
            { label: 'Widget' },
            { label: 'Site address' },
            { label: 'Assignee' },
            { label: 'Received' },
          ]}
        >
          {leads.data.items.map((l) => (
            <LeadRow key={l.id} lead={l} />
          ))}
        </PagedTable>
      </div>
    );
  }

  return (
    <section className="space-y-6">
      <PageHeader
        title="Enquiries"
        lead="Visitors who asked for a site assessment after using a widget. Take one, note what was agreed, and move it along."
        actions={
          <a
            href={`/api/v1/orgs/${orgId}/leads/export${filters ? `?${filters}` : ''}`}
            download
            className={buttonClass()}
          >
            Download CSV
          </a>
        }
      />
      <FilterBar label="Filters">
        <FilterSelect
          label="Status"
          value={current('status')}
          options={leadStatusOptions}
          onChange={(v) => set('status', v)}
        />
        <FilterSelect
          label="Widget"
          value={current('widgetId')}
          options={(widgets.data?.items ?? []).map((w) => ({ value: String(w.id), label: w.name }))}
          onChange={(v) => set('widgetId', v)}
        />
        <FilterSelect
          label="Assignee"
          value={current('assigneeId')}
          allLabel="Anyone"
          options={[
            { value: 'none', label: 'Nobody yet' },
            ...(members.data?.items ?? []).map((m) => ({ value: String(m.userId), label: m.name })),
          ]}
          onChange={(v) => set('assigneeId', v)}
        />
        <FilterSearch label="Name, e-mail or company" value={current('q')} onSearch={(v) => set('q', v)} />
      </FilterBar>
      {body}
    </section>
  );
}
