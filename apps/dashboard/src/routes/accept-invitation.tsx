import { useQuery } from '@tanstack/react-query';
import { useNavigate, useParams } from 'react-router';
import {
  acceptInvitationBodySchema,
  loginBodySchema,
  signupBodySchema,
  type MeResponse,
} from '@wickstone/contracts';
import { isApiError } from '../lib/api';
import { useSchemaForm, type Parser } from '../lib/form';
import { roleLabel, roleSummary, formatDate } from '../lib/labels';
import { homeFor } from '../lib/session';
import { usePageTitle } from '../lib/use-page-title';
import { invitationPreviewQuery, useAcceptInvitation } from '../queries/invitations';
import { meQuery } from '../queries/session';
import { AuthPage } from '../components/auth-page';
import { NewPasswordField, PasswordField, SchemaFormView, TextField } from '../components/form';
import { Email } from '../components/email';
import { ErrorState, LoadingState } from '../components/states';
import { Button, Notice, TextLink } from '../components/ui';

/** A new person chooses a name and a password held to the sign-up rules; an existing one proves who they are. */
const newPersonSchema = signupBodySchema.pick({ name: true, password: true });
const existingPersonSchema = loginBodySchema.pick({ password: true });

/** The organisation just joined: the membership that is new, else the one with the invitation's name. */
function joinedOrg(
  before: MeResponse | null | undefined,
  after: MeResponse,
  organizationName: string,
): string {
  const known = new Set(before?.memberships.map((m) => m.organizationId));
  const named = after.memberships.filter((m) => m.organizationName === organizationName);
  const joined = named.find((m) => !known.has(m.organizationId)) ?? named[0];
  return joined ? `/orgs/${joined.organizationId}` : homeFor(after);
}

export function AcceptInvitationPage() {
  usePageTitle('Join your team');
  const token = useParams().token ?? '';
  const preview = useQuery({ ...invitationPreviewQuery(token), enabled: token.length >= 20 });
  const me = useQuery(meQuery());
  const accept = useAcceptInvitation(token);
  const navigate = useNavigate();

  const signedInAsInvitee =
    me.data && preview.data && me.data.user.email.toLowerCase() === preview.data.email.toLowerCase();
  const schema: Parser<{ name?: string; password?: string }> = signedInAsInvitee
    ? acceptInvitationBodySchema
    : preview.data?.existingUser
      ? existingPersonSchema
      : newPersonSchema;
  const form = useSchemaForm(schema, (body, { showServerError }) =>
    accept.mutate(body, {
      onSuccess: (after) =>
        navigate(joinedOrg(me.data, after, preview.data?.organizationName ?? ''), { replace: true }),
      onError: (error) => showServerError(error),
    }),
  );

  if (token.length < 20 || isApiError(preview.error, 404) || isApiError(preview.error, 400)) {
    return (
      <AuthPage
        title="This invitation cannot be used"
        lead="It was already accepted, withdrawn, or it has expired. Ask the person who invited you to send a new one."
        footer={<TextLink to="/login">Go to sign in</TextLink>}
      />
    );
  }
  if (preview.isPending) return <LoadingState label="Opening the invitation…" />;
  if (preview.isError)
    return (
      <ErrorState
        title="The invitation could not be opened"
        error={preview.error}
        onRetry={() => void preview.refetch()}
      />
    );

  const invitation = preview.data;
  return (
    <AuthPage
      eyebrow="Invitation"
      title={`Join ${invitation.organizationName}`}
      lead={
        <>
          as <strong className="text-ink">{roleLabel[invitation.role]}</strong>:{' '}
          {roleSummary[invitation.role].toLowerCase()}
        </>
      }
    >
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 rounded-md border border-line bg-card px-4 py-3 text-sm">
        <dt className="text-ink-soft">For</dt>
        <dd className="font-semibold">
          <Email address={invitation.email} />
        </dd>
        <dt className="text-ink-soft">Open until</dt>
        <dd>{formatDate(invitation.expiresAt)}</dd>
      </dl>

      {me.data && !signedInAsInvitee ? (
        <Notice tone="warn">
          You are signed in as {me.data.user.email}. Accepting signs you in as {invitation.email} instead.
        </Notice>
      ) : null}

      <SchemaFormView form={form}>
        {signedInAsInvitee ? (
          <p className="text-ink-soft">You are signed in with this address already.</p>
        ) : invitation.existingUser ? (
          <>
            <p className="text-ink-soft">This address already has a Wickstone account. Confirm it is you:</p>
            <PasswordField
              label="Your password"
              name="password"
              autoComplete="current-password"
              error={form.errors.password}
            />
            <p className="text-sm">
              <TextLink to="/forgot-password">Forgot your password?</TextLink>
            </p>
          </>
        ) : (
          <>
            <TextField label="Your name" name="name" autoComplete="name" error={form.errors.name} />
            <NewPasswordField label="Choose a password" name="password" error={form.errors.password} />
          </>
        )}
        <Button type="submit" tone="primary" busy={accept.isPending}>
          Accept and join
        </Button>
      </SchemaFormView>
    </AuthPage>
  );
}
