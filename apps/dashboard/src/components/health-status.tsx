import { useQuery } from '@tanstack/react-query';
import { healthQuery } from '../queries/health';
import { ApiError } from '../lib/api';

/**
 * The imprint line at the foot of the public pages: the server's version when it answers, and a
 * plain sentence when it does not. Timings belong on a system page, not in front of visitors.
 */
export function HealthStatus({ className = '' }: { className?: string }) {
  const { data, error, isPending } = useQuery(healthQuery());
  const base = `text-sm ${className}`;
  if (isPending) return <p className={`${base} text-ink-soft`}>Wickstone</p>;
  if (error) {
    const message = error instanceof ApiError ? error.body.message : 'the server cannot be reached';
    return (
      <p role="status" data-health="down" className={`${base} font-semibold text-bad`}>
        Wickstone is not answering just now ({message}). Try again in a minute.
      </p>
    );
  }
  return (
    <p data-health="ok" className={`${base} text-ink-soft`}>
      Wickstone {data.version} · capillarity calculators for ground, damp and surface work
    </p>
  );
}
