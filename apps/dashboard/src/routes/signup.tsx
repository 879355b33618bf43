import { useNavigate } from 'react-router';
import { signupBodySchema, type SignupBody } from '@wickstone/contracts';
import { useSchemaForm } from '../lib/form';
import { homeFor } from '../lib/session';
import { usePageTitle } from '../lib/use-page-title';
import { useSignup } from '../queries/session';
import { AuthPage } from '../components/auth-page';
import { NewPasswordField, SchemaFormView, TextField } from '../components/form';
import { Button, TextLink } from '../components/ui';

export function SignupPage() {
  usePageTitle('Set up your firm');
  const navigate = useNavigate();
  const signup = useSignup();
  const form = useSchemaForm(signupBodySchema, (body: SignupBody, { showServerError }) =>
    signup.mutate(body, {
      onSuccess: (me) => navigate(homeFor(me), { replace: true }),
      onError: (error) => showServerError(error),
    }),
  );

  return (
    <AuthPage
      title="Set up your firm"
      lead="You become its owner and can invite your colleagues next."
      footer={
        <>
          Already have an account? <TextLink to="/login">Sign in</TextLink>
        </>
      }
    >
      <SchemaFormView form={form}>
        <TextField
          label="Firm or organisation"
          name="organizationName"
          autoComplete="organization"
          error={form.errors.organizationName}
        />
        <TextField label="Your name" name="name" autoComplete="name" error={form.errors.name} />
        <TextField
          label="Work e-mail address"
          name="email"
          type="email"
          autoComplete="email"
          error={form.errors.email}
        />
        <NewPasswordField label="Password" name="password" error={form.errors.password} />
        <Button type="submit" tone="primary" busy={signup.isPending}>
          Create the organisation
        </Button>
      </SchemaFormView>
    </AuthPage>
  );
}
