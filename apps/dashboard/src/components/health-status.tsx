import { useQuery } from '@tanstack/react-query';
import { healthQuery } from '../queries/health';
import { ApiError } from '../lib/api';

/** The live service check: a small line in the public footer and on the overview. */
export function HealthStatus({ className = '' }: { className?: string }) {
  const { data, error, isPending } = useQuery(healthQuery());
  const base = `inline-flex items-start gap-2 text-sm ${className}`;
  if (isPending) {
    return (
      <p role="status" className={`${base} text-ink-soft`}>
        <span aria-hidden="true" className="mt-1.5 h-2 w-2 shrink-0 rounded-full bg-line-strong" />
        Checking the service…
      </p>
    );
  }
  if (error) {
    const message = error instanceof ApiError ? error.body.message : 'The server cannot be reached';
    return (
      <p role="status" data-health="down" className={`${base} font-semibold text-bad`}>
        <span aria-hidden="true" className="mt-1.5 h-2 w-2 shrink-0 rounded-full bg-bad" />
        Service degraded: {message}
      </p>
    );
  }
  return (
    <p role="status" data-health="ok" className={`${base} text-ink-soft`}>
      <span aria-hidden="true" className="mt-1.5 h-2 w-2 shrink-0 rounded-full bg-ok" />
      <span>
        <span className="font-semibold text-ok">Service healthy</span> · database round trip{' '}
        {data.database.roundTripMs} ms · server {data.version}
      </span>
    </p>
  );
}
