import { useEffect, useRef } from 'react';
import { useQuery } from '@tanstack/react-query';
import { forgotPasswordBodySchema } from '@wickstone/contracts';
import { useSchemaForm } from '../lib/form';
import { usePageTitle } from '../lib/use-page-title';
import { useForgotPassword } from '../queries/session';
import { devMailQuery } from '../queries/dev-mail';
import { AuthPage } from '../components/auth-page';
import { SchemaFormView, TextField } from '../components/form';
import { Button, Notice, TextLink } from '../components/ui';

export function ForgotPasswordPage() {
  usePageTitle('Reset your password');
  const forgot = useForgotPassword();
  const devMail = useQuery(devMailQuery());
  const form = useSchemaForm(forgotPasswordBodySchema, (body: { email: string }, { showServerError }) =>
    forgot.mutate(body, { onError: (error) => showServerError(error) }),
  );
  const doneRef = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (forgot.isSuccess) doneRef.current?.focus();
  }, [forgot.isSuccess]);

  return (
    <AuthPage
      title="Reset your password"
      lead="We e-mail you a link to choose a new one. It works once, for an hour."
      footer={
        <>
          Remembered it? <TextLink to="/login">Back to sign in</TextLink>
        </>
      }
    >
      {forgot.isSuccess ? (
        <div ref={doneRef} tabIndex={-1} className="space-y-3">
          <Notice tone="ok" role="status">
            If an account uses <strong>{forgot.variables.email}</strong>, a reset link is on its way. Check
            that inbox (and its spam folder) in a minute or two.
          </Notice>
          {devMail.isSuccess ? (
            <p className="text-sm text-ink-soft">
              Running locally: the message is in the <TextLink to="/dev/mail">dev mailbox</TextLink>.
            </p>
          ) : null}
          <Button size="sm" onClick={() => forgot.reset()}>
            Use another address
          </Button>
        </div>
      ) : (
        <SchemaFormView form={form}>
          <TextField
            label="E-mail address"
            name="email"
            type="email"
            autoComplete="email"
            error={form.errors.email}
          />
          <Button type="submit" tone="primary" busy={forgot.isPending}>
            Send the link
          </Button>
        </SchemaFormView>
      )}
    </AuthPage>
  );
}
