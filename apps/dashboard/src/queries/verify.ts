import { queryOptions } from '@tanstack/react-query';
import { verifyResponseSchema } from '@wickstone/contracts';
import { apiFetch } from '../lib/api';

/** A run re-computed by the engine and compared with what was stored: public, no personal data. */
export const verifyQuery = (runId: string) =>
  queryOptions({
    queryKey: ['verify', runId],
    queryFn: async () => verifyResponseSchema.parse(await apiFetch(`/verify/${encodeURIComponent(runId)}`)),
    staleTime: 60_000,
    retry: false,
    meta: { public: true },
  });
