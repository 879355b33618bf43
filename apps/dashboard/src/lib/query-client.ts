import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api';
import { retryDelay, shouldRetry } from './outage';
import { meKey } from '../queries/session';

/*
 * One client for the app and the route loaders. A 401 from any signed-in request means the session
 * ended (expired or revoked elsewhere): marking "me" as signed out makes the shell send the person
 * to the sign-in page, with a way back to where they were.
 */
function sessionEnded(error: unknown, own: boolean) {
  if (own) return;
  if (isApiError(error, 401)) queryClient.setQueryData(meKey, null);
  // A refusal or a vanished organisation usually means a role changed or a membership ended
  // since "me" was read: read it again so the navigation and guards follow.
  else if (isApiError(error, 403, 'forbidden') || isApiError(error, 404))
    void queryClient.invalidateQueries({ queryKey: meKey });
}

export const queryClient: QueryClient = new QueryClient({
  queryCache: new QueryCache({ onError: (error, query) => sessionEnded(error, query.meta?.public === true) }),
  mutationCache: new MutationCache({
    onError: (error, _vars, _ctx, mutation) => sessionEnded(error, mutation.meta?.public === true),
  }),
  defaultOptions: {
    queries: {
      staleTime: 15_000,
      // Through an outage (503, or no answer) keep trying as Retry-After asks, with a banner
      // (OutageBanner); other 5xx get two more tries; a 4xx will not change by asking again.
      retry: shouldRetry,
      retryDelay,
    },
  },
});

declare module '@tanstack/react-query' {
  interface Register {
    /** `public`: a 401 here is an answer (wrong password, signed out), not an ended session. */
    queryMeta: { public?: boolean };
    mutationMeta: { public?: boolean };
  }
}
