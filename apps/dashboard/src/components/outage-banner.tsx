import { useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { isOutage } from '../lib/outage';

/**
 * A calm line at the top of every page while the server answers "temporarily unavailable" (503)
 * or cannot be reached and queries are trying again. It goes away by itself when they succeed.
 */
export function OutageBanner() {
  const cache = useQueryClient().getQueryCache();
  const retrying = useSyncExternalStore(
    (onChange) => cache.subscribe(onChange),
    () =>
      cache
        .getAll()
        .some(
          (q) =>
            q.state.fetchStatus === 'fetching' &&
            q.state.fetchFailureCount > 0 &&
            isOutage(q.state.fetchFailureReason),
        ),
  );
  return (
    <div role="status" aria-live="polite" className="empty:hidden">
      {retrying ? (
        <div
          data-outage="retrying"
          className="border-b border-warn/30 bg-warn-tint px-4 py-2 text-center text-sm text-warn"
        >
          <span className="font-semibold">Temporarily unavailable, retrying.</span> This page carries on by
          itself when the service is back.
        </div>
      ) : null}
    </div>
  );
}
