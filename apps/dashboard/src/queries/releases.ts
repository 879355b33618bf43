import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  orgRefusedOriginsSchema,
  refusedOriginsSchema,
  releaseListSchema,
  upgradePreviewSchema,
  widgetSchema,
} from '@wickstone/contracts';
import { apiFetch } from '../lib/api';
import { widgetsKey } from './widgets';

export const releasesQuery = () =>
  queryOptions({
    queryKey: ['releases'],
    queryFn: async () => releaseListSchema.parse(await apiFetch('/releases')),
    staleTime: 60_000,
  });

export const upgradePreviewQuery = (orgId: number, widgetId: number, to: string) =>
  queryOptions({
    queryKey: [...widgetsKey(orgId), widgetId, 'upgrade-preview', to],
    queryFn: async () =>
      upgradePreviewSchema.parse(
        await apiFetch(`/orgs/${orgId}/widgets/${widgetId}/upgrade-preview?to=${encodeURIComponent(to)}`),
      ),
  });

export const refusedOriginsQuery = (orgId: number, widgetId: number) =>
  queryOptions({
    queryKey: [...widgetsKey(orgId), widgetId, 'refused-origins'],
    queryFn: async () =>
      refusedOriginsSchema.parse(await apiFetch(`/orgs/${orgId}/widgets/${widgetId}/refused-origins`)),
  });

/** Every widget's refused sites in one answer (the overview's card). */
export const orgRefusedOriginsQuery = (orgId: number) =>
  queryOptions({
    queryKey: [...widgetsKey(orgId), 'refused-origins'],
    queryFn: async () => orgRefusedOriginsSchema.parse(await apiFetch(`/orgs/${orgId}/refused-origins`)),
  });

/** Moving the pin changes the widget (its snippet and SRI) and its history. */
export function usePinRelease(orgId: number, widgetId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (pin: string) =>
      widgetSchema.parse(
        await apiFetch(`/orgs/${orgId}/widgets/${widgetId}/release`, { method: 'PUT', json: { pin } }),
      ),
    onSuccess: async () => {
      await client.invalidateQueries({ queryKey: widgetsKey(orgId) });
    },
  });
}
