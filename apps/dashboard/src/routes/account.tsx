import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { updateAccountBodySchema, type MeResponse } from '@wickstone/contracts';
import { requireFields, useSchemaForm } from '../lib/form';
import { roleLabel } from '../lib/labels';
import { usePageTitle } from '../lib/use-page-title';
import { orgPath } from '../nav';
import { meQuery, useUpdateAccount } from '../queries/session';
import { FormCard, NewPasswordField, PasswordField, TextField } from '../components/form';
import { LoadingState } from '../components/states';
import { Button, Card, LiveMessage, PageHeader, TextLink } from '../components/ui';

const nameSchema = requireFields(updateAccountBodySchema, ['name']);
const passwordSchema = requireFields(updateAccountBodySchema, ['currentPassword', 'newPassword']);

function NameForm({ me, announce }: { me: MeResponse; announce: (m: string) => void }) {
  const update = useUpdateAccount();
  const form = useSchemaForm(nameSchema, (body, { showServerError }) =>
    update.mutate(body, {
      onSuccess: (after) => announce(`Your name is now ${after.user.name}.`),
      onError: (error) => showServerError(error),
    }),
  );
  return (
    <FormCard
      title="Your name"
      lead="Shown to your colleagues in the team list and the audit log."
      form={form}
    >
      <TextField
        label="Name"
        name="name"
        autoComplete="name"
        defaultValue={me.user.name}
        error={form.errors.name}
      />
      <Button type="submit" tone="primary" busy={update.isPending}>
        Save the name
      </Button>
    </FormCard>
  );
}

function PasswordForm({ announce }: { announce: (m: string) => void }) {
  const update = useUpdateAccount();
  const form = useSchemaForm(passwordSchema, (body, { showServerError, formRef }) =>
    update.mutate(body, {
      onSuccess: () => {
        formRef.current?.reset();
        announce('Your password is changed. Other browsers signed in as you have been signed out.');
      },
      onError: (error) => showServerError(error),
    }),
  );
  return (
    <FormCard title="Password" lead="Changing it signs you out everywhere else." form={form}>
      <PasswordField
        label="Current password"
        name="currentPassword"
        autoComplete="current-password"
        error={form.errors.currentPassword}
      />
      <NewPasswordField label="New password" name="newPassword" error={form.errors.newPassword} />
      <Button type="submit" tone="primary" busy={update.isPending}>
        Change the password
      </Button>
    </FormCard>
  );
}

export function AccountPage() {
  usePageTitle('Your account');
  const me = useQuery(meQuery()).data;
  const [message, setMessage] = useState<string | null>(null);
  if (!me) return <LoadingState label="Loading your account…" />;
  return (
    <section className="space-y-6">
      <PageHeader
        title="Your account"
        lead={
          <>
            Signed in as <strong className="text-ink">{me.user.email}</strong>.
          </>
        }
      />
      <LiveMessage message={message} />
      <div className="grid gap-6 lg:grid-cols-2 lg:items-start">
        <NameForm me={me} announce={setMessage} />
        <PasswordForm announce={setMessage} />
      </div>
      <Card className="p-5">
        <h2 className="text-lg font-bold tracking-tight">Memberships</h2>
        {me.memberships.length === 0 ? (
          <p className="mt-2 text-sm text-ink-soft">You belong to no organisation at the moment.</p>
        ) : (
          <ul className="mt-3 divide-y divide-line">
            {me.memberships.map((m) => (
              <li key={m.organizationId} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <TextLink to={orgPath(m.organizationId)}>{m.organizationName}</TextLink>
                <span className="text-sm text-ink-soft">{roleLabel[m.role]}</span>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </section>
  );
}
