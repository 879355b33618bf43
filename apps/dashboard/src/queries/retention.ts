import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { retentionSchema, type RetentionBody } from '@wickstone/contracts';
import { apiFetch } from '../lib/api';

export const retentionKey = (orgId: number) => ['orgs', orgId, 'settings', 'retention'] as const;

export const retentionQuery = (orgId: number) =>
  queryOptions({
    queryKey: retentionKey(orgId),
    queryFn: async () => retentionSchema.parse(await apiFetch(`/orgs/${orgId}/settings/retention`)),
  });

export function useSetRetention(orgId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: RetentionBody) =>
      retentionSchema.parse(
        await apiFetch(`/orgs/${orgId}/settings/retention`, { method: 'PATCH', json: body }),
      ),
    onSuccess: (after) => {
      client.setQueryData(retentionKey(orgId), after);
      // The change is in the audit log.
      void client.invalidateQueries({ queryKey: ['orgs', orgId, 'audit'] });
    },
  });
}
