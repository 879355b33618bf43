import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router';
import { can } from '@wickstone/contracts';
import { formatDateTime } from '../lib/labels';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import { orgPath } from '../nav';
import { runQuery } from '../queries/usage';
import { RunRecord } from '../components/run-record';
import { ErrorState, LoadingState } from '../components/states';
import { buttonClass, Card, PageHeader, TextLink } from '../components/ui';
import { leadStatusLabel } from '../lib/lead-labels';

export function RunPage() {
  usePageTitle('Run');
  const { orgId, role } = useOrg();
  const runId = useParams().runId ?? '';
  const run = useQuery(runQuery(orgId, runId));
  const back = <TextLink to={orgPath(orgId, 'usage')}>← Back to usage</TextLink>;

  let body;
  if (run.isPending) body = <LoadingState label="Loading the run…" />;
  else if (run.isError)
    body = (
      <ErrorState title="This run could not be loaded" error={run.error} onRetry={() => void run.refetch()} />
    );
  else {
    const lead = run.data.lead;
    body = (
      <div className="space-y-6">
        <RunRecord run={run.data} />
        <Card className="p-4">
          <h2 className="text-lg font-bold tracking-tight">Request for an assessment</h2>
          {!lead ? (
            <p className="mt-1 text-sm text-ink-soft">
              The visitor did not ask for an assessment from this run.
            </p>
          ) : (
            <p className="mt-1 text-sm">
              {lead.erasedAt ? 'Personal data erased' : (lead.name ?? 'No name given')} ·{' '}
              {leadStatusLabel[lead.status]} · sent {formatDateTime(lead.createdAt)}
              {can(role, 'leads:read') ? (
                <>
                  {' · '}
                  <TextLink to={orgPath(orgId, `leads/${lead.id}`)}>Open the enquiry</TextLink>
                </>
              ) : null}
            </p>
          )}
        </Card>
      </div>
    );
  }

  return (
    <section className="space-y-6">
      {back}
      <PageHeader
        title={run.data ? `Run of ${run.data.widget.name}` : 'Run'}
        lead="What the visitor entered and saw, and the server's check of it."
        actions={
          run.data ? (
            <>
              <a
                href={`/api/v1/orgs/${orgId}/runs/${encodeURIComponent(runId)}/sheet`}
                download
                className={buttonClass()}
              >
                Download calculation sheet
              </a>
              <a href={`/verify/${encodeURIComponent(runId)}`} className={buttonClass()}>
                Verification page
              </a>
            </>
          ) : null
        }
      />
      {body}
    </section>
  );
}
