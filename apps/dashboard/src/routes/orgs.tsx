import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { roleLabel, roleSummary } from '../lib/labels';
import { usePageTitle } from '../lib/use-page-title';
import { orgPath } from '../nav';
import { meQuery } from '../queries/session';
import { EmptyState, LoadingState } from '../components/states';
import { PageHeader } from '../components/ui';

/** Every organisation the person belongs to; also where someone with none lands. */
export function OrgsPage() {
  usePageTitle('Organisations');
  const me = useQuery(meQuery()).data;
  if (!me) return <LoadingState label="Loading your organisations…" />;
  return (
    <section className="space-y-6">
      <PageHeader title="Organisations" lead="The organisations you belong to, and your role in each." />
      {me.memberships.length === 0 ? (
        <EmptyState title="You are not in any organisation">
          An owner or admin of your firm can invite you; the link in their e-mail adds you to the team.
        </EmptyState>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2">
          {me.memberships.map((m) => (
            <li key={m.organizationId}>
              <Link
                to={orgPath(m.organizationId)}
                className="block h-full rounded-lg border border-line bg-card p-5 transition-colors hover:border-brand"
              >
                <span className="block text-lg font-bold">{m.organizationName}</span>
                <span className="mt-1 block text-sm font-semibold text-brand">{roleLabel[m.role]}</span>
                <span className="mt-1 block text-sm text-ink-soft">{roleSummary[m.role]}</span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
