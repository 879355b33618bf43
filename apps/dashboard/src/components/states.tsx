import type { ReactNode } from 'react';
import { isApiError } from '../lib/api';
import { Button, Spinner } from './ui';

export function LoadingState({ label }: { label: string }) {
  return (
    <div role="status" className="flex items-center gap-3 py-10 text-ink-soft">
      <Spinner className="text-accent" />
      <span>{label}</span>
    </div>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-line-strong bg-paper/60 px-6 py-8 text-center">
      <p className="font-semibold">{title}</p>
      {children ? <div className="mt-1 text-sm text-ink-soft">{children}</div> : null}
    </div>
  );
}

/** Words for a failed request that a person can act on. */
export function describeError(error: unknown): string {
  if (isApiError(error, 403))
    return 'Your role does not include this. Ask an owner or admin of the organisation if you need it.';
  if (isApiError(error, 404)) return 'There is nothing here, or it is no longer available.';
  if (isApiError(error, 0)) return 'The server cannot be reached just now.';
  if (isApiError(error)) return error.body.message;
  return 'Something unexpected happened in the dashboard.';
}

export function ErrorState({
  title,
  error,
  onRetry,
}: {
  title: string;
  error: unknown;
  onRetry?: () => void;
}) {
  return (
    <div role="alert" className="space-y-3 rounded-lg border border-bad/40 bg-bad-tint px-5 py-4 text-bad">
      <p className="font-semibold">{title}</p>
      <p className="text-sm">{describeError(error)}</p>
      {onRetry && !isApiError(error, 403) && !isApiError(error, 404) ? (
        <Button size="sm" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}
