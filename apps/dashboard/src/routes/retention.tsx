import { useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { Retention } from '@wickstone/contracts';
import { can } from '@wickstone/contracts';
import { useOrg } from '../lib/org-context';
import { formatDateTime } from '../lib/labels';
import { usePageTitle } from '../lib/use-page-title';
import { retentionQuery, useSetRetention } from '../queries/retention';
import { FormError, SelectField } from '../components/form';
import { ErrorState, LoadingState, describeError } from '../components/states';
import { Button, Card, LiveMessage, Notice, PageHeader } from '../components/ui';

/** The periods offered; a period set through the API that is not among them is offered too. */
const CHOICES = [6, 12, 24, 36, 60, 120];

const inWords = (months: number | null) =>
  months === null
    ? 'kept until someone deletes them'
    : months % 12 === 0
      ? `${months / 12} ${months === 12 ? 'year' : 'years'}`
      : `${months} months`;

function RetentionForm({ orgId, current }: { orgId: number; current: Retention }) {
  const set = useSetRetention(orgId);
  const [choice, setChoice] = useState(current.months === null ? 'keep' : String(current.months));
  const [message, setMessage] = useState<string | null>(null);
  const options = [
    { value: 'keep', label: 'Keep runs and enquiries' },
    ...[...new Set([...CHOICES, ...(current.months === null ? [] : [current.months])])]
      .sort((a, b) => a - b)
      .map((m) => ({ value: String(m), label: `Delete after ${inWords(m)}` })),
  ];
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const months = choice === 'keep' ? null : Number(choice);
    set.mutate(
      { months },
      {
        onSuccess: (after) =>
          setMessage(
            `Saved: runs and enquiries are ${after.months === null ? 'kept' : `deleted after ${inWords(after.months)}`}.`,
          ),
      },
    );
  };
  return (
    <form onSubmit={submit} className="mt-4 space-y-4" aria-label="Retention period">
      <SelectField
        label="Runs and enquiries"
        name="months"
        value={choice}
        onChange={(e) => setChoice(e.target.value)}
        options={options}
        hint="A daily clean-up deletes runs and enquiries older than this. Usage totals for the deleted days go with them."
      />
      <FormError message={set.isError ? describeError(set.error) : null} />
      <Button type="submit" tone="primary" busy={set.isPending}>
        Save the retention period
      </Button>
      <LiveMessage message={message} />
    </form>
  );
}

export function RetentionPage() {
  usePageTitle('Data retention');
  const { orgId, role } = useOrg();
  const retention = useQuery(retentionQuery(orgId));
  const writable = can(role, 'settings:write');

  let body;
  if (retention.isPending) body = <LoadingState label="Loading the retention period…" />;
  else if (retention.isError)
    body = (
      <ErrorState
        title="The retention period could not be loaded"
        error={retention.error}
        onRetry={() => void retention.refetch()}
      />
    );
  else {
    const r = retention.data;
    body = (
      <Card className="p-5">
        <h2 className="text-lg font-bold tracking-tight">How long runs and enquiries are kept</h2>
        <p className="mt-1 text-sm text-ink-soft">
          {r.months === null
            ? 'Every run and enquiry is kept.'
            : `Runs and enquiries are deleted ${inWords(r.months)} after they arrive.`}{' '}
          {r.cutoff ? `The next clean-up deletes what arrived before ${formatDateTime(r.cutoff)}.` : null}
        </p>
        {writable ? (
          <RetentionForm key={String(r.months)} orgId={orgId} current={r} />
        ) : (
          <Notice className="mt-4">Owners and admins choose the retention period.</Notice>
        )}
      </Card>
    );
  }
  return (
    <section className="space-y-6">
      <PageHeader
        title="Data retention"
        lead="Keep visitors' runs and enquiries only as long as the firm needs them. Deleting an enquiry's personal data early is done on the enquiry itself."
      />
      {body}
    </section>
  );
}
