import { useMutation, useQueryClient } from '@tanstack/react-query';
import { widgetSchema, type KeyRotationBody } from '@wickstone/contracts';
import { apiFetch } from '../lib/api';
import { widgetsKey } from './widgets';

/** The developer's list of allowed sites (`embed:manage`): the widget, its history and its refusals change. */
export function useSetOrigins(orgId: number, widgetId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (origins: string[]) =>
      widgetSchema.parse(
        await apiFetch(`/orgs/${orgId}/widgets/${widgetId}/origins`, { method: 'PUT', json: { origins } }),
      ),
    onSuccess: async (widget) => {
      client.setQueryData([...widgetsKey(orgId), widgetId], widget);
      await client.invalidateQueries({ queryKey: widgetsKey(orgId) });
    },
  });
}

/** A new key, the old one served until the chosen date: the widget (its snippet) changes. */
export function useRotateKey(orgId: number, widgetId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: KeyRotationBody) =>
      widgetSchema.parse(
        await apiFetch(`/orgs/${orgId}/widgets/${widgetId}/key-rotations`, { method: 'POST', json: body }),
      ),
    onSuccess: async (widget) => {
      client.setQueryData([...widgetsKey(orgId), widgetId], widget);
      await client.invalidateQueries({ queryKey: widgetsKey(orgId) });
    },
  });
}

/** Stop serving the replaced key now: pages still carrying it show no widget from this moment. */
export function useEndKeyOverlap(orgId: number, widgetId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async () =>
      widgetSchema.parse(
        await apiFetch(`/orgs/${orgId}/widgets/${widgetId}/key-rotations/end-overlap`, { method: 'POST' }),
      ),
    onSuccess: async (widget) => {
      client.setQueryData([...widgetsKey(orgId), widgetId], widget);
      await client.invalidateQueries({ queryKey: widgetsKey(orgId) });
    },
  });
}
