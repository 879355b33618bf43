import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import {
  can,
  canAssignRole,
  inviteBodySchema,
  roles,
  type Member,
  type MembersResponse,
  type Role,
} from '@wickstone/contracts';
import { isApiError } from '../lib/api';
import { useSchemaForm } from '../lib/form';
import { formatDate, roleLabel, roleSummary } from '../lib/labels';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import {
  membersQuery,
  useChangeRole,
  useInvite,
  useRemoveMember,
  useResendInvitation,
  useRevokeInvitation,
} from '../queries/members';
import { ConfirmAction } from '../components/confirm';
import { Email } from '../components/email';
import { DataTable, table } from '../components/table';
import { FormCard, SelectField, TextField } from '../components/form';
import { EmptyState, ErrorState, LoadingState, describeError } from '../components/states';
import { Badge, Button, LiveMessage, PageHeader } from '../components/ui';

type Announce = (message: string, tone?: 'ok' | 'bad') => void;

/** Words for a refused team change: the last-owner rule gets its own explanation. */
function refusal(error: unknown): string {
  if (isApiError(error, 409))
    return error.body.message || 'That would leave the organisation without an owner.';
  return describeError(error);
}

const tdClass = `${table.td} align-middle`;
const personCell = `${tdClass} ${table.wide}`;
const actionsCell = `${tdClass} text-right max-sm:text-left`;

function InviteForm({ announce }: { announce: Announce }) {
  const { orgId, role } = useOrg();
  const invite = useInvite(orgId);
  const choices = roles.filter((r) => canAssignRole(role, r));
  const [chosen, setChosen] = useState<Role>('analyst');
  const form = useSchemaForm(
    inviteBodySchema,
    (body: { email: string; role: Role }, { showServerError, formRef }) =>
      invite.mutate(body, {
        onSuccess: (invitation) => {
          formRef.current?.reset();
          setChosen('analyst');
          announce(`Invitation sent to ${invitation.email} as ${roleLabel[invitation.role]}.`);
        },
        onError: (error) => showServerError(error),
      }),
  );
  return (
    <FormCard
      title="Invite someone"
      lead="They get an e-mail with a link that works for a limited time."
      form={form}
      formClassName="mt-4 grid gap-4 sm:grid-cols-[1fr_12rem_auto] sm:items-start"
      errorClassName="sm:col-span-3"
    >
      <TextField
        label="E-mail address"
        name="email"
        type="email"
        autoComplete="off"
        error={form.errors.email}
      />
      <SelectField
        label="Role"
        name="role"
        value={chosen}
        onChange={(e) => setChosen(e.target.value as Role)}
        options={choices.map((r) => ({ value: r, label: roleLabel[r] }))}
        error={form.errors.role}
      />
      <Button type="submit" tone="primary" busy={invite.isPending} className="sm:mt-7">
        Send invitation
      </Button>
      <p className="text-sm text-ink-soft sm:col-span-3">
        <strong className="text-ink">{roleLabel[chosen]}:</strong> {roleSummary[chosen]}
      </p>
    </FormCard>
  );
}

function RoleEditor({ member, announce }: { member: Member; announce: Announce }) {
  const { orgId, role, userId } = useOrg();
  const change = useChangeRole(orgId, member.userId === userId);
  const [draft, setDraft] = useState<Role>(member.role);
  const choices = roles.filter((r) => canAssignRole(role, r));
  const selectId = `role-${member.userId}`;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label htmlFor={selectId} className="sr-only">
        Role of {member.name}
      </label>
      <select
        id={selectId}
        value={draft}
        onChange={(e) => setDraft(e.target.value as Role)}
        className="rounded-md border border-line-strong bg-card px-2 py-1 text-sm"
      >
        {choices.map((r) => (
          <option key={r} value={r}>
            {roleLabel[r]}
          </option>
        ))}
      </select>
      {draft !== member.role ? (
        <>
          <Button
            size="sm"
            tone="primary"
            busy={change.isPending}
            onClick={() =>
              change.mutate(
                { userId: member.userId, role: draft },
                {
                  onSuccess: (updated) => announce(`${updated.name} is now ${roleLabel[updated.role]}.`),
                  onError: (error) => {
                    setDraft(member.role);
                    announce(`The role of ${member.name} was not changed: ${refusal(error)}`, 'bad');
                  },
                },
              )
            }
          >
            Save
          </Button>
          <Button size="sm" onClick={() => setDraft(member.role)}>
            Cancel
          </Button>
        </>
      ) : null}
    </div>
  );
}

function MemberRow({ member, announce }: { member: Member; announce: Announce }) {
  const { orgId, role, userId } = useOrg();
  const remove = useRemoveMember(orgId);
  const self = member.userId === userId;
  // Admins cannot touch owners, and nobody edits their own row here (that is how people lock themselves out).
  const editable = can(role, 'members:manage') && canAssignRole(role, member.role) && !self;
  return (
    <tr className={table.row}>
      <td className={personCell}>
        <div className="font-semibold">
          {member.name}
          {self ? <span className="ml-2 text-sm font-normal text-ink-soft">(you)</span> : null}
        </div>
        <div className="text-sm text-ink-soft">
          <Email address={member.email} />
        </div>
      </td>
      <td className={tdClass}>
        {editable ? (
          <RoleEditor key={member.role} member={member} announce={announce} />
        ) : (
          <Badge tone={member.role === 'owner' ? 'brand' : 'neutral'}>{roleLabel[member.role]}</Badge>
        )}
      </td>
      <td className={`${tdClass} hidden text-sm whitespace-nowrap text-ink-soft sm:table-cell`}>
        {formatDate(member.joinedAt)}
      </td>
      {can(role, 'members:manage') ? (
        <td className={actionsCell}>
          {editable ? (
            <ConfirmAction
              label="Remove"
              question={`Remove ${member.name}?`}
              confirmLabel="Remove"
              busy={remove.isPending}
              onConfirm={() =>
                remove.mutate(member.userId, {
                  onSuccess: () => announce(`${member.name} was removed from the team.`),
                  onError: (error) => announce(`${member.name} was not removed: ${refusal(error)}`, 'bad'),
                })
              }
            />
          ) : null}
        </td>
      ) : null}
    </tr>
  );
}

function MembersTable({ data, announce }: { data: MembersResponse; announce: Announce }) {
  const { role } = useOrg();
  const manage = can(role, 'members:manage');
  if (data.items.length === 0) return <EmptyState title="No members yet" />;
  return (
    <DataTable
      caption="Members"
      columns={[
        { label: 'Person' },
        { label: 'Role' },
        { label: 'Joined', className: 'hidden sm:table-cell' },
        manage ? { label: 'Actions', hiddenLabel: true } : null,
      ]}
    >
      {data.items.map((m) => (
        <MemberRow key={m.userId} member={m} announce={announce} />
      ))}
    </DataTable>
  );
}

function InvitationsTable({ data, announce }: { data: MembersResponse; announce: Announce }) {
  const { orgId, role } = useOrg();
  const revoke = useRevokeInvitation(orgId);
  const resend = useResendInvitation(orgId);
  const manage = can(role, 'members:manage');
  if (data.invitations.length === 0) {
    return (
      <EmptyState title="No open invitations">
        {manage ? 'Invitations you send wait here until they are accepted.' : null}
      </EmptyState>
    );
  }
  return (
    <DataTable
      caption="Open invitations"
      columns={[
        { label: 'Invited' },
        { label: 'Role' },
        { label: 'Open until', className: 'hidden sm:table-cell' },
        manage ? { label: 'Actions', hiddenLabel: true } : null,
      ]}
    >
      {data.invitations.map((inv) => (
        <tr key={inv.id} className={table.row}>
          <td className={personCell}>
            <div className="font-semibold">
              <Email address={inv.email} />
            </div>
            <div className="text-sm text-ink-soft">by {inv.invitedBy}</div>
          </td>
          <td className={tdClass}>
            <Badge tone="warn">{roleLabel[inv.role]}</Badge>
          </td>
          <td className={`${tdClass} hidden text-sm whitespace-nowrap text-ink-soft sm:table-cell`}>
            {formatDate(inv.expiresAt)}
          </td>
          {manage ? (
            <td className={actionsCell}>
              {canAssignRole(role, inv.role) ? (
                <div className="flex flex-wrap items-center gap-2 sm:justify-end">
                  <Button
                    size="sm"
                    busy={resend.isPending && resend.variables === inv.id}
                    onClick={() =>
                      resend.mutate(inv.id, {
                        onSuccess: (again) =>
                          announce(`A new link was sent to ${again.email}; the earlier one no longer works.`),
                        onError: (error) =>
                          announce(`The invitation was not sent again: ${refusal(error)}`, 'bad'),
                      })
                    }
                  >
                    Send again
                  </Button>
                  <ConfirmAction
                    label="Withdraw"
                    question={`Withdraw the invitation to ${inv.email}?`}
                    confirmLabel="Withdraw"
                    busy={revoke.isPending && revoke.variables === inv.id}
                    onConfirm={() =>
                      revoke.mutate(inv.id, {
                        onSuccess: () =>
                          announce(`The invitation to ${inv.email} was withdrawn; its link no longer works.`),
                        onError: (error) =>
                          announce(`The invitation was not withdrawn: ${refusal(error)}`, 'bad'),
                      })
                    }
                  />
                </div>
              ) : null}
            </td>
          ) : null}
        </tr>
      ))}
    </DataTable>
  );
}

export function TeamPage() {
  usePageTitle('Team');
  const { orgId, role, organizationName } = useOrg();
  const members = useQuery(membersQuery(orgId));
  const [message, setMessage] = useState<{ text: string; tone: 'ok' | 'bad' } | null>(null);
  const announce: Announce = (text, tone = 'ok') => setMessage({ text, tone });
  const manage = can(role, 'members:manage');

  return (
    <section className="space-y-6">
      <PageHeader
        title="Team"
        lead={
          manage
            ? `Who works in ${organizationName}, and what each person may do.`
            : `Who works in ${organizationName}. Owners and admins invite people and change roles.`
        }
      />
      <LiveMessage message={message?.text ?? null} tone={message?.tone ?? 'ok'} />
      {manage ? <InviteForm announce={announce} /> : null}
      {members.isPending ? (
        <LoadingState label="Loading the team…" />
      ) : members.isError ? (
        <ErrorState
          title="The team could not be loaded"
          error={members.error}
          onRetry={() => void members.refetch()}
        />
      ) : (
        <>
          <div className="space-y-3">
            <h2 className="text-lg font-bold tracking-tight">
              Members <span className="font-semibold text-ink-soft">({members.data.items.length})</span>
            </h2>
            <MembersTable data={members.data} announce={announce} />
          </div>
          <div className="space-y-3">
            <h2 className="text-lg font-bold tracking-tight">
              Open invitations{' '}
              <span className="font-semibold text-ink-soft">({members.data.invitations.length})</span>
            </h2>
            <InvitationsTable data={members.data} announce={announce} />
          </div>
        </>
      )}
    </section>
  );
}
