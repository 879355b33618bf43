import { useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router';
import { can, MAX_LEAD_NOTE, type LeadDetail, type LeadStatus } from '@wickstone/contracts';
import { isApiError } from '../lib/api';
import { formatDateTime } from '../lib/labels';
import { leadStatusLabel, leadStatusOptions } from '../lib/lead-labels';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import { orgPath } from '../nav';
import { membersQuery } from '../queries/members';
import { leadQuery, useAddLeadNote, useEraseLead, useUpdateLead } from '../queries/usage';
import { ConfirmAction } from '../components/confirm';
import { FormError, SelectField } from '../components/form';
import { RunRecord } from '../components/run-record';
import { ErrorState, LoadingState, describeError } from '../components/states';
import { Button, Card, LiveMessage, Notice, PageHeader, TextLink } from '../components/ui';
import { LeadStatusBadge } from './leads';

function Contact({ lead }: { lead: LeadDetail }) {
  const rows: [string, string | null][] = [
    ['Name', lead.name],
    ['E-mail', lead.email],
    ['Company', lead.company],
    ['Phone', lead.phone],
    ['Site address', lead.siteAddress],
    ['Message', lead.message],
  ];
  return (
    <Card className="p-4">
      <h2 className="text-lg font-bold tracking-tight">Contact</h2>
      {lead.erasedAt ? (
        <Notice tone="info" className="mt-2">
          The personal data of this enquiry was erased on {formatDateTime(lead.erasedAt)}. The run it came
          from stays, so the usage figures do not change.
        </Notice>
      ) : (
        <dl className="mt-2 grid grid-cols-[8rem_minmax(0,1fr)] gap-x-4 gap-y-1.5 text-sm">
          {rows.map(([label, value]) => (
            <div key={label} className="contents">
              <dt className="text-ink-soft">{label}</dt>
              <dd className="break-words whitespace-pre-wrap">
                {label === 'E-mail' && value ? (
                  <a
                    href={`mailto:${value}`}
                    className="font-semibold text-brand underline underline-offset-4"
                  >
                    {value}
                  </a>
                ) : (
                  (value ?? <span className="text-ink-faint">Not given</span>)
                )}
              </dd>
            </div>
          ))}
        </dl>
      )}
      <p className="mt-3 text-xs text-ink-soft">
        From {lead.origin} via {lead.widget.name} · received {formatDateTime(lead.createdAt)} · consent given{' '}
        {formatDateTime(lead.consentAt)}: “{lead.consentText}”{lead.sendCopy ? ' · asked for a copy' : ''}
      </p>
    </Card>
  );
}

function WorkForm({ lead, writable }: { lead: LeadDetail; writable: boolean }) {
  const { orgId } = useOrg();
  const members = useQuery(membersQuery(orgId));
  const update = useUpdateLead(orgId, lead.id);
  const [status, setStatus] = useState<LeadStatus>(lead.status);
  const [assignee, setAssignee] = useState(lead.assignee ? String(lead.assignee.id) : '');
  const [saved, setSaved] = useState<string | null>(null);
  const fieldError = (field: string) =>
    isApiError(update.error)
      ? update.error.fields.find((f) => f.field === `body.${field}`)?.message
      : undefined;
  const formError =
    update.error && !(isApiError(update.error, 400) && update.error.fields.length)
      ? describeError(update.error)
      : null;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setSaved(null);
    update.mutate(
      { status, assigneeId: assignee ? Number(assignee) : null },
      {
        onSuccess: (l) => {
          // Show what the server now holds, and say so where it is announced.
          setStatus(l.status);
          setAssignee(l.assignee ? String(l.assignee.id) : '');
          setSaved(`Saved. Status: ${leadStatusLabel[l.status]}.`);
        },
      },
    );
  };
  const memberOptions = [
    { value: '', label: 'Nobody yet' },
    ...(members.data?.items ?? []).map((m) => ({ value: String(m.userId), label: `${m.name} (${m.email})` })),
    // The current assignee stays choosable while the member list loads, or after they left.
    ...(lead.assignee && !members.data?.items.some((m) => m.userId === lead.assignee?.id)
      ? [{ value: String(lead.assignee.id), label: lead.assignee.name }]
      : []),
  ];

  return (
    <Card className="p-4">
      <h2 className="text-lg font-bold tracking-tight">Follow-up</h2>
      {!writable ? (
        <p className="mt-1 text-sm text-ink-soft">Your role can read this enquiry but not change it.</p>
      ) : null}
      <form onSubmit={submit} noValidate className="mt-3 space-y-4">
        <FormError message={formError} />
        <SelectField
          label="Status"
          name="status"
          value={status}
          disabled={!writable || Boolean(lead.erasedAt)}
          options={leadStatusOptions}
          error={fieldError('status')}
          onChange={(e) => setStatus(e.target.value as LeadStatus)}
        />
        <SelectField
          label="Assignee"
          name="assigneeId"
          value={assignee}
          disabled={!writable || Boolean(lead.erasedAt)}
          options={memberOptions}
          error={fieldError('assigneeId')}
          onChange={(e) => setAssignee(e.target.value)}
        />
        <LiveMessage message={saved} />
        {writable && !lead.erasedAt ? (
          <Button type="submit" tone="primary" busy={update.isPending}>
            Save
          </Button>
        ) : null}
      </form>
    </Card>
  );
}

/** The firm's dated notes on the enquiry, oldest first, and a box to add one. */
function Notes({ lead, writable }: { lead: LeadDetail; writable: boolean }) {
  const { orgId } = useOrg();
  const add = useAddLeadNote(orgId, lead.id);
  const [draft, setDraft] = useState('');
  const [saved, setSaved] = useState<string | null>(null);
  const id = `lead-note-${lead.id}`;
  const error = isApiError(add.error)
    ? (add.error.fields.find((f) => f.field === 'body.body')?.message ?? describeError(add.error))
    : add.error
      ? describeError(add.error)
      : undefined;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    setSaved(null);
    add.mutate(
      { body: draft },
      {
        onSuccess: () => {
          setDraft('');
          setSaved('Note added.');
        },
      },
    );
  };
  return (
    <Card className="p-4">
      <h2 className="text-lg font-bold tracking-tight">Notes</h2>
      {lead.notes.length === 0 ? (
        <p className="mt-1 text-sm text-ink-soft">
          {lead.erasedAt ? 'The notes were erased with the personal data.' : 'No notes yet.'}
        </p>
      ) : (
        <ol className="mt-2 space-y-3" aria-label="Notes, oldest first">
          {lead.notes.map((n) => (
            <li key={n.id} className="border-l-2 border-line-strong pl-3">
              <p className="text-xs text-ink-soft">
                <time dateTime={n.createdAt}>{formatDateTime(n.createdAt)}</time> ·{' '}
                {n.author?.name ?? 'a former member'}
              </p>
              <p className="whitespace-pre-wrap break-words text-sm">{n.body}</p>
            </li>
          ))}
        </ol>
      )}
      {writable && !lead.erasedAt ? (
        <form onSubmit={submit} noValidate className="mt-4 space-y-2">
          <label htmlFor={id} className="block text-sm font-semibold">
            Add a note
          </label>
          <textarea
            id={id}
            name="body"
            rows={3}
            maxLength={MAX_LEAD_NOTE}
            value={draft}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-error` : undefined}
            onChange={(e) => setDraft(e.target.value)}
            className="block w-full rounded-md border border-line-strong bg-card px-3 py-2 text-ink aria-invalid:border-bad"
          />
          {error ? (
            <p id={`${id}-error`} className="text-sm font-semibold text-bad">
              {error}
            </p>
          ) : null}
          <LiveMessage message={saved} />
          <Button type="submit" tone="primary" busy={add.isPending}>
            Add the note
          </Button>
        </form>
      ) : null}
    </Card>
  );
}

function Erase({ lead }: { lead: LeadDetail }) {
  const { orgId } = useOrg();
  const erase = useEraseLead(orgId, lead.id);
  return (
    <Card className="space-y-2 p-4">
      <h2 className="text-lg font-bold tracking-tight">Erase personal data</h2>
      <p className="text-sm text-ink-soft">
        When the visitor asks, remove their name, contact details, message, address and the notes. The run
        stays, so the usage figures do not change. This cannot be undone.
      </p>
      {erase.isError ? <ErrorState title="The data could not be erased" error={erase.error} /> : null}
      <ConfirmAction
        label="Erase personal data"
        question="Erase this visitor's personal data for good?"
        confirmLabel="Erase"
        busy={erase.isPending}
        onConfirm={() => erase.mutate(undefined)}
      />
    </Card>
  );
}

export function LeadPage() {
  usePageTitle('Enquiry');
  const { orgId, role } = useOrg();
  const leadId = Number(useParams().leadId);
  const valid = Number.isInteger(leadId) && leadId > 0;
  const lead = useQuery({ ...leadQuery(orgId, valid ? leadId : 0), enabled: valid });

  let body;
  if (!valid) body = <ErrorState title="This is not an enquiry's address" error={null} />;
  else if (lead.isPending) body = <LoadingState label="Loading the enquiry…" />;
  else if (lead.isError)
    body = (
      <ErrorState
        title="This enquiry could not be loaded"
        error={lead.error}
        onRetry={() => void lead.refetch()}
      />
    );
  else {
    const l = lead.data;
    body = (
      <div className="space-y-6">
        <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <Contact lead={l} />
          {/* A fresh form after an erasure. */}
          <WorkForm key={`${l.id}-${l.erasedAt ?? ''}`} lead={l} writable={can(role, 'leads:write')} />
        </div>
        <Notes lead={l} writable={can(role, 'leads:write')} />
        <section aria-labelledby="lead-run" className="space-y-3">
          <h2 id="lead-run" className="text-lg font-bold tracking-tight">
            The run it came from
          </h2>
          {l.run ? (
            <>
              <RunRecord run={l.run} />
              <TextLink to={orgPath(orgId, `usage/runs/${l.run.id}`)}>Open the run on its own page</TextLink>
            </>
          ) : (
            <p className="text-sm text-ink-soft">The run is no longer kept.</p>
          )}
        </section>
        {can(role, 'leads:erase') && !l.erasedAt ? <Erase lead={l} /> : null}
      </div>
    );
  }

  return (
    <section className="space-y-6">
      <TextLink to={orgPath(orgId, 'leads')}>← Back to enquiries</TextLink>
      <PageHeader
        title={
          lead.data
            ? lead.data.erasedAt
              ? `Enquiry ${lead.data.id}`
              : (lead.data.name ?? `Enquiry ${lead.data.id}`)
            : 'Enquiry'
        }
        lead={lead.data ? <LeadStatusBadge lead={lead.data} /> : undefined}
      />
      {body}
    </section>
  );
}
