import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router';
import type { DevMailMessage } from '@wickstone/contracts';
import { isApiError } from '../lib/api';
import { formatDateTime } from '../lib/labels';
import { usePageTitle } from '../lib/use-page-title';
import { devMailQuery } from '../queries/dev-mail';
import { Email } from '../components/email';
import { EmptyState, ErrorState, LoadingState } from '../components/states';
import { BrandLink, Button, Card, Notice, Spinner } from '../components/ui';

const shownAtOnce = 30;
/** The server answers with the newest messages only (its default limit). */
const serverLimit = 100;

function countText(n: number): string {
  if (n >= serverLimit) return `the latest ${n} messages`;
  return n === 1 ? '1 message' : `${n} messages`;
}

/** A link into this dashboard is shown by its path, so the token-bearing part is what stands out. */
function linkText(href: string): string {
  try {
    const url = new URL(href);
    return url.origin === window.location.origin ? `${url.pathname}${url.search}` : href;
  } catch {
    return href;
  }
}

function Message({ message }: { message: DevMailMessage }) {
  const titleId = `mail-${message.id}`;
  return (
    <Card className="space-y-3 p-5">
      <article aria-labelledby={titleId} data-mail-to={message.to.join(' ')} className="space-y-3">
        <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
          <h2 id={titleId} className="text-lg font-bold tracking-tight">
            {message.subject || '(no subject)'}
          </h2>
          <time dateTime={message.receivedAt} className="text-sm text-ink-soft">
            {formatDateTime(message.receivedAt)}
          </time>
        </div>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
          <dt className="text-ink-soft">To</dt>
          <dd className="font-semibold">
            <Email address={message.to.join(', ')} />
          </dd>
          <dt className="text-ink-soft">From</dt>
          <dd>
            <Email address={message.from} />
          </dd>
        </dl>
        {message.links.length > 0 ? (
          <ul className="space-y-1" aria-label="Links in this message">
            {message.links.map((href) => (
              <li key={href}>
                <a
                  href={href}
                  className="text-sm font-semibold break-all text-brand underline underline-offset-4"
                >
                  {linkText(href)}
                </a>
              </li>
            ))}
          </ul>
        ) : null}
        <details className="group">
          <summary className="cursor-pointer rounded-md text-sm font-semibold text-ink-soft">
            Message text
          </summary>
          <pre className="mt-2 overflow-x-auto rounded-md bg-paper p-3 font-sans text-sm whitespace-pre-wrap">
            {message.text}
          </pre>
        </details>
      </article>
    </Card>
  );
}

/** The local mail stand-in's messages, so invitation and reset links can be followed without a real inbox. */
export function DevMailPage() {
  usePageTitle('Dev mailbox');
  const [params, setParams] = useSearchParams();
  const to = params.get('to') ?? '';
  const mail = useQuery({ ...devMailQuery(to), placeholderData: (previous) => previous });
  const [limit, setLimit] = useState(shownAtOnce);

  let body;
  if (mail.isPending) body = <LoadingState label="Reading the mailbox…" />;
  else if (isApiError(mail.error, 404))
    body = (
      <Notice tone="info">
        The dev mailbox is off: this server sends its e-mail through a real mail server, so messages are in
        the recipients' own inboxes.
      </Notice>
    );
  else if (mail.isError)
    body = (
      <ErrorState
        title="The mailbox could not be read"
        error={mail.error}
        onRetry={() => void mail.refetch()}
      />
    );
  else {
    const needle = to.trim().toLowerCase();
    const list = needle
      ? mail.data.items.filter((m) => m.to.some((a) => a.toLowerCase().includes(needle)))
      : mail.data.items;
    body =
      list.length === 0 ? (
        <EmptyState title={needle ? `No messages to “${to}”` : 'No messages yet'}>
          Invitations and password-reset e-mails appear here a moment after they are sent.
        </EmptyState>
      ) : (
        <div className="space-y-4">
          {list.slice(0, limit).map((m) => (
            <Message key={m.id} message={m} />
          ))}
          {list.length > limit ? (
            <Button onClick={() => setLimit((l) => l + shownAtOnce)}>
              Show {Math.min(shownAtOnce, list.length - limit)} more
            </Button>
          ) : null}
        </div>
      );
  }

  return (
    <div className="min-h-screen">
      <header className="on-dark bg-brand-strong text-brand-tint">
        <div className="mx-auto flex max-w-4xl flex-wrap items-center gap-x-4 gap-y-2 px-5 py-4">
          <BrandLink />
          <span className="rounded-full border border-warn-tint/50 px-2 py-0.5 text-xs font-semibold text-warn-tint">
            local development only
          </span>
        </div>
      </header>
      <main id="main" className="mx-auto max-w-4xl space-y-6 px-5 py-8">
        <div className="flex flex-wrap items-end justify-between gap-4 border-b border-line pb-5">
          <div className="space-y-1">
            <h1 className="text-2xl font-bold tracking-tight">Dev mailbox</h1>
            <p className="max-w-2xl text-ink-soft">
              Every e-mail the app sent while it runs with the local mail stand-in, newest first. Follow a
              link to act on it as the recipient.
            </p>
          </div>
          {/* Not a live region: the list refreshes every few seconds and must not chatter. */}
          <p className="flex items-center gap-2 text-sm text-ink-soft">
            {mail.isFetching ? <Spinner /> : null}
            {mail.isSuccess ? countText(mail.data.items.length) : null}
          </p>
        </div>
        {mail.isSuccess ? (
          <form role="search" onSubmit={(e) => e.preventDefault()} className="flex flex-wrap items-end gap-3">
            <div className="min-w-[16rem] flex-1 space-y-1.5">
              <label htmlFor="mail-to" className="block text-sm font-semibold">
                Recipient contains
              </label>
              <input
                id="mail-to"
                type="search"
                value={to}
                onChange={(e) => setParams(e.target.value ? { to: e.target.value } : {}, { replace: true })}
                className="block w-full rounded-md border border-line-strong bg-card px-3 py-2"
              />
            </div>
            <Button onClick={() => void mail.refetch()} busy={mail.isFetching && !mail.isPending}>
              Check again
            </Button>
          </form>
        ) : null}
        {body}
      </main>
    </div>
  );
}
