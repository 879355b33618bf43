import { useQuery } from '@tanstack/react-query';
import { leadStatusWords, widgetStatusWords, type AuditEntry } from '@wickstone/contracts';
import { auditLabel, formatDateTime, roleLabel } from '../lib/labels';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import { usePageParam } from '../lib/usage-filters';
import { auditQuery } from '../queries/audit';
import { Email } from '../components/email';
import { table } from '../components/table';
import { NoSuchPage, PagedTable } from '../components/paged-table';
import { EmptyState, ErrorState, LoadingState } from '../components/states';
import { PageHeader } from '../components/ui';

const pageSize = 25;

const tdClass = `${table.td} align-top text-sm`;

/**
 * The entry's details as short "key: value" notes for a person: role names get their labels,
 * internal ids and anything the "Concerning" column already shows are left out, a true flag is
 * just its name.
 */
function detailText(entry: AuditEntry): string {
  return Object.entries(entry.details)
    .filter(
      ([k, v]) =>
        v !== null &&
        v !== undefined &&
        v !== '' &&
        v !== false &&
        !/(^id|Id)$/.test(k) &&
        v !== entry.subject,
    )
    .map(([k, v]) => {
      const key = k.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
      if (v === true) return key;
      // A stored status code reads as the word the screens use for it.
      const statusWords: Record<string, string> | null =
        k !== 'status'
          ? null
          : entry.type.startsWith('lead.')
            ? leadStatusWords
            : entry.type.startsWith('widget.')
              ? widgetStatusWords
              : null;
      const word = (x: unknown): string =>
        x === null || x === undefined
          ? 'none'
          : typeof x === 'string' && statusWords && x in statusWords
            ? (statusWords[x] ?? x)
            : typeof x === 'string' && x in roleLabel
              ? roleLabel[x as keyof typeof roleLabel]
              : typeof x === 'object'
                ? // A small record (a plan and its standing): its fields in words, not JSON.
                  Object.entries(x)
                    .map(([k, y]) => `${k} ${String(y)}`)
                    .join(', ')
                : String(x);
      const value = Array.isArray(v)
        ? v.map(word).join(', ')
        : typeof v === 'object' && v !== null && 'from' in v && 'to' in v
          ? `${word(v.from)} → ${word(v.to)}`
          : word(v);
      return `${key}: ${value}`;
    })
    .join(' · ');
}

export function AuditPage() {
  usePageTitle('Audit log');
  const { orgId } = useOrg();
  const [page, goTo] = usePageParam();
  const audit = useQuery(auditQuery(orgId, page, pageSize));

  let body;
  if (audit.isPending) body = <LoadingState label="Loading the audit log…" />;
  else if (audit.isError)
    body = (
      <ErrorState
        title="The audit log could not be loaded"
        error={audit.error}
        onRetry={() => void audit.refetch()}
      />
    );
  else if (audit.data.items.length === 0)
    body =
      page > 1 ? (
        <NoSuchPage page={page} onFirst={() => goTo(1)} first="Go to the newest entries" />
      ) : (
        <EmptyState title="Nothing recorded yet">
          Sign-ins, invitations and role changes appear here as they happen.
        </EmptyState>
      );
  else {
    body = (
      <PagedTable
        noun="entries"
        page={page}
        pageSize={pageSize}
        total={audit.data.total}
        loading={audit.isPlaceholderData}
        back="← Newer"
        forward="Older →"
        onPage={goTo}
        caption="Audit log, newest first"
        columns={[
          { label: 'When' },
          { label: 'Event' },
          { label: 'By' },
          { label: 'Concerning' },
          { label: 'From', className: 'hidden lg:table-cell' },
        ]}
      >
        {audit.data.items.map((e) => (
          <tr key={e.id} className={table.row}>
            <td className={`${tdClass} ${table.wide} whitespace-nowrap text-ink-soft max-sm:text-xs`}>
              <time dateTime={e.createdAt}>{formatDateTime(e.createdAt)}</time>
            </td>
            <td className={`${tdClass} ${table.wide}`}>
              <span className={`font-semibold ${e.type === 'auth.login_failed' ? 'text-bad' : ''}`}>
                {auditLabel[e.type]}
              </span>
              {detailText(e) ? <div className="text-ink-soft">{detailText(e)}</div> : null}
            </td>
            <td
              data-label="By"
              className={`${tdClass} ${table.wide} ${table.labelled} ${e.actor ? '' : 'max-sm:hidden'}`}
            >
              {e.actor ? (
                <>
                  <span className="sm:block">{e.actor.name}</span>
                  <div className="text-ink-soft max-sm:hidden">
                    <Email address={e.actor.email} />
                  </div>
                </>
              ) : (
                <span className="text-ink-soft">—</span>
              )}
            </td>
            <td
              data-label="Concerning"
              className={`${tdClass} ${table.wide} ${table.labelled} ${e.subject ? '' : 'max-sm:hidden'}`}
            >
              {e.subject ? <Email address={e.subject} /> : <span className="text-ink-soft">—</span>}
            </td>
            <td className={`${tdClass} hidden text-ink-soft tabular-nums lg:table-cell`}>{e.ip ?? '—'}</td>
          </tr>
        ))}
      </PagedTable>
    );
  }

  return (
    <section className="space-y-6">
      <PageHeader
        title="Audit log"
        lead="Sign-ins and refused sign-ins, the team, widgets, enquiries, retention and the plan: who changed what, newest first."
      />
      {body}
    </section>
  );
}
