import { keepPreviousData, queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  leadDetailSchema,
  leadNoteSchema,
  leadListResponseSchema,
  leadSchema,
  runDetailSchema,
  runListResponseSchema,
  usageSummarySchema,
  type AddLeadNoteBody,
  type UpdateLeadBody,
} from '@wickstone/contracts';
import { apiFetch } from '../lib/api';

/*
 * Runs, the usage summary and leads. Filters travel as the URL's own search string, so the
 * screen, its query key and its CSV link all read the same parameters.
 */
export const runsKey = (orgId: number) => ['orgs', orgId, 'runs'] as const;
export const leadsKey = (orgId: number) => ['orgs', orgId, 'leads'] as const;
export const usageKey = (orgId: number) => ['orgs', orgId, 'usage'] as const;

export const runListQuery = (orgId: number, search: string) =>
  queryOptions({
    queryKey: [...runsKey(orgId), 'list', search],
    queryFn: async () => runListResponseSchema.parse(await apiFetch(`/orgs/${orgId}/runs?${search}`)),
    placeholderData: keepPreviousData,
  });

export const runQuery = (orgId: number, runId: string) =>
  queryOptions({
    queryKey: [...runsKey(orgId), 'one', runId],
    queryFn: async () =>
      runDetailSchema.parse(await apiFetch(`/orgs/${orgId}/runs/${encodeURIComponent(runId)}`)),
  });

export const usageSummaryQuery = (orgId: number, search: string) =>
  queryOptions({
    queryKey: [...usageKey(orgId), 'summary', search],
    queryFn: async () => usageSummarySchema.parse(await apiFetch(`/orgs/${orgId}/usage/summary?${search}`)),
    placeholderData: keepPreviousData,
  });

export const leadListQuery = (orgId: number, search: string) =>
  queryOptions({
    queryKey: [...leadsKey(orgId), 'list', search],
    queryFn: async () => leadListResponseSchema.parse(await apiFetch(`/orgs/${orgId}/leads?${search}`)),
    placeholderData: keepPreviousData,
  });

export const leadQuery = (orgId: number, leadId: number) =>
  queryOptions({
    queryKey: [...leadsKey(orgId), 'one', leadId],
    queryFn: async () => leadDetailSchema.parse(await apiFetch(`/orgs/${orgId}/leads/${leadId}`)),
  });

/**
 * A lead's change shows in its list, on its run's page (which names the lead's status) and in the
 * usage summary (which counts leads).
 */
function useLeadMutation<V, R>(orgId: number, mutationFn: (vars: V) => Promise<R>) {
  const client = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: async () => {
      await Promise.all([
        client.invalidateQueries({ queryKey: leadsKey(orgId) }),
        client.invalidateQueries({ queryKey: runsKey(orgId) }),
        client.invalidateQueries({ queryKey: usageKey(orgId) }),
      ]);
    },
  });
}

export function useUpdateLead(orgId: number, leadId: number) {
  // The answer is the lead without its run (the run does not change); the detail is re-read.
  return useLeadMutation(orgId, async (body: UpdateLeadBody) =>
    leadSchema.parse(await apiFetch(`/orgs/${orgId}/leads/${leadId}`, { method: 'PATCH', json: body })),
  );
}

export function useAddLeadNote(orgId: number, leadId: number) {
  return useLeadMutation(orgId, async (body: AddLeadNoteBody) =>
    leadNoteSchema.parse(
      await apiFetch(`/orgs/${orgId}/leads/${leadId}/notes`, { method: 'POST', json: body }),
    ),
  );
}

export function useEraseLead(orgId: number, leadId: number) {
  return useLeadMutation(orgId, () =>
    apiFetch<unknown>(`/orgs/${orgId}/leads/${leadId}/personal-data`, { method: 'DELETE' }),
  );
}
