import { keepPreviousData, queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  assetSchema,
  widgetListSchema,
  widgetRevisionListSchema,
  widgetSchema,
  type Asset,
  type Widget,
} from '@wickstone/contracts';
import { apiFetch } from '../lib/api';
import type { UpdateWidgetBody } from '../lib/widget-draft';

export const widgetsKey = (orgId: number) => ['orgs', orgId, 'widgets'] as const;
const widgetKey = (orgId: number, widgetId: number) => [...widgetsKey(orgId), widgetId] as const;

export const widgetListQuery = (orgId: number, page: number, pageSize: number) =>
  queryOptions({
    queryKey: [...widgetsKey(orgId), 'list', { page, pageSize }],
    queryFn: async () =>
      widgetListSchema.parse(await apiFetch(`/orgs/${orgId}/widgets?page=${page}&pageSize=${pageSize}`)),
    placeholderData: keepPreviousData,
  });

export const widgetQuery = (orgId: number, widgetId: number) =>
  queryOptions({
    queryKey: widgetKey(orgId, widgetId),
    queryFn: async () => widgetSchema.parse(await apiFetch(`/orgs/${orgId}/widgets/${widgetId}`)),
  });

export const widgetRevisionsQuery = (orgId: number, widgetId: number, page: number, pageSize: number) =>
  queryOptions({
    queryKey: [...widgetKey(orgId, widgetId), 'revisions', { page, pageSize }],
    queryFn: async () =>
      widgetRevisionListSchema.parse(
        await apiFetch(`/orgs/${orgId}/widgets/${widgetId}/revisions?page=${page}&pageSize=${pageSize}`),
      ),
    placeholderData: keepPreviousData,
  });

export function useCreateWidget(orgId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: { name: string; calculatorId: string }) =>
      widgetSchema.parse(await apiFetch(`/orgs/${orgId}/widgets`, { method: 'POST', json: body })),
    onSuccess: async (widget) => {
      client.setQueryData(widgetKey(orgId, widget.id), widget);
      await client.invalidateQueries({ queryKey: [...widgetsKey(orgId), 'list'] });
    },
  });
}

/** A save: the list, this widget and its history all change (every save is a revision). */
export function useUpdateWidget(orgId: number, widgetId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: UpdateWidgetBody) =>
      widgetSchema.parse(
        await apiFetch(`/orgs/${orgId}/widgets/${widgetId}`, { method: 'PATCH', json: body }),
      ),
    onSuccess: async (widget: Widget) => {
      client.setQueryData(widgetKey(orgId, widgetId), widget);
      await Promise.all([
        client.invalidateQueries({ queryKey: [...widgetsKey(orgId), 'list'] }),
        client.invalidateQueries({ queryKey: [...widgetKey(orgId, widgetId), 'revisions'] }),
      ]);
    },
  });
}

/** Puts an earlier revision back: a save like any other, so the same three things change. */
export function useRestoreRevision(orgId: number, widgetId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (revisionId: number) =>
      widgetSchema.parse(
        await apiFetch(`/orgs/${orgId}/widgets/${widgetId}/revisions/${revisionId}/restore`, {
          method: 'POST',
        }),
      ),
    onSuccess: async (widget: Widget) => {
      client.setQueryData(widgetKey(orgId, widgetId), widget);
      await Promise.all([
        client.invalidateQueries({ queryKey: [...widgetsKey(orgId), 'list'] }),
        client.invalidateQueries({ queryKey: [...widgetKey(orgId, widgetId), 'revisions'] }),
      ]);
    },
  });
}

/** A logo upload: multipart, field `file`, through the same client (CSRF token, error shape) as every call. */
async function uploadAsset(orgId: number, file: File): Promise<Asset> {
  const form = new FormData();
  form.append('file', file);
  return assetSchema.parse(await apiFetch(`/orgs/${orgId}/assets`, { method: 'POST', form }));
}

export function useUploadLogo(orgId: number) {
  return useMutation({ mutationFn: (file: File) => uploadAsset(orgId, file) });
}
