import { useState } from 'react';
import { useLocation, useNavigate, useSearchParams } from 'react-router';
import { loginBodySchema, type LoginBody } from '@wickstone/contracts';
import { useSchemaForm } from '../lib/form';
import { homeFor, safeNext } from '../lib/session';
import { usePageTitle } from '../lib/use-page-title';
import { useLogin } from '../queries/session';
import { AuthPage } from '../components/auth-page';
import { PasswordField, SchemaFormView, TextField } from '../components/form';
import { Button, Notice, TextLink } from '../components/ui';
import { SlowedNotice, useSecondsLeft } from '../components/slowed-notice';
import { isApiError } from '../lib/api';

export interface NoticeState {
  notice?: string;
}

export function LoginPage() {
  usePageTitle('Sign in');
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const notice = (useLocation().state as NoticeState | null)?.notice;
  const next = safeNext(params.get('next'));
  const login = useLogin();
  const [slowed, setSlowed] = useState<{ until: number; byClient: boolean } | null>(null);
  const secondsLeft = useSecondsLeft(slowed?.until ?? null);
  const form = useSchemaForm(loginBodySchema, (body: LoginBody, { showServerError, reset }) =>
    login.mutate(body, {
      onSuccess: (me) => navigate(next ?? homeFor(me), { replace: true }),
      onError: (error) => {
        if (isApiError(error, 429) && error.retryAfterS) {
          const by = (error.body.details as { slowedBy?: unknown } | null)?.slowedBy;
          setSlowed({ until: Date.now() + error.retryAfterS * 1000, byClient: by === 'client' });
          reset();
          return;
        }
        setSlowed(null);
        showServerError(error);
      },
    }),
  );

  return (
    <AuthPage
      title="Sign in"
      lead="to your firm's Wickstone workspace."
      footer={
        <>
          New to Wickstone? <TextLink to="/signup">Set up your firm</TextLink>
        </>
      }
    >
      {notice ? (
        <Notice tone="ok" role="status">
          {notice}
        </Notice>
      ) : null}
      {next && !notice ? <Notice>Sign in to continue to the page you asked for.</Notice> : null}
      {slowed ? <SlowedNotice secondsLeft={secondsLeft} byClient={slowed.byClient} /> : null}
      <SchemaFormView form={form}>
        <TextField
          label="E-mail address"
          name="email"
          type="email"
          autoComplete="username"
          error={form.errors.email}
        />
        <PasswordField
          label="Password"
          name="password"
          autoComplete="current-password"
          error={form.errors.password}
        />
        <div className="flex flex-wrap items-center justify-between gap-3 pt-1">
          <Button type="submit" tone="primary" busy={login.isPending} disabled={secondsLeft > 0}>
            Sign in
          </Button>
          <TextLink to="/forgot-password" className="text-sm">
            Forgot your password?
          </TextLink>
        </div>
      </SchemaFormView>
    </AuthPage>
  );
}
