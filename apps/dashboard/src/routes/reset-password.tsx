import { useNavigate, useSearchParams } from 'react-router';
import { resetPasswordBodySchema } from '@wickstone/contracts';
import { isApiError } from '../lib/api';
import { useSchemaForm } from '../lib/form';
import { usePageTitle } from '../lib/use-page-title';
import { useResetPassword } from '../queries/session';
import { AuthPage } from '../components/auth-page';
import { NewPasswordField, SchemaFormView } from '../components/form';
import { Button, Notice, TextLink } from '../components/ui';
import type { NoticeState } from './login';

const spentLink = 'This reset link has expired or was already used. Ask for a new one below.';

export function ResetPasswordPage() {
  usePageTitle('Choose a new password');
  const navigate = useNavigate();
  const token = useSearchParams()[0].get('token') ?? '';
  const reset = useResetPassword();
  const form = useSchemaForm(
    resetPasswordBodySchema,
    (body: { token: string; password: string }, { showServerError }) =>
      reset.mutate(body, {
        onSuccess: () =>
          navigate('/login', {
            replace: true,
            state: { notice: 'Your password is changed. Sign in with the new one.' } satisfies NoticeState,
          }),
        onError: (error) => showServerError(error, { token: spentLink }),
      }),
    (values) => ({ ...values, token }),
  );
  // The token has no input of its own: its problem is told above the form, with the way out.
  const tokenBroken = isApiError(reset.error) && reset.error.fields.some((f) => f.field === 'body.token');

  return (
    <AuthPage
      title="Choose a new password"
      lead="It replaces the old one and signs you out everywhere else."
      footer={
        tokenBroken ? (
          <TextLink to="/forgot-password">Ask for a new link</TextLink>
        ) : (
          <TextLink to="/login">Back to sign in</TextLink>
        )
      }
    >
      {token.length < 20 ? (
        <Notice tone="warn" role="alert">
          This page needs the link from the reset e-mail, and this address has no valid token in it.{' '}
          <TextLink to="/forgot-password">Ask for a new link</TextLink>.
        </Notice>
      ) : (
        <SchemaFormView form={form}>
          <NewPasswordField label="New password" name="password" error={form.errors.password} />
          <Button type="submit" tone="primary" busy={reset.isPending}>
            Save the new password
          </Button>
        </SchemaFormView>
      )}
    </AuthPage>
  );
}
