import { keepPreviousData, queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  assetSchema,
  csrfResponseSchema,
  errorBodySchema,
  widgetListSchema,
  widgetRevisionListSchema,
  widgetSchema,
  type Asset,
  type Widget,
} from '@wickstone/contracts';
import { ApiError, apiFetch } from '../lib/api';
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

async function send(orgId: number, file: File, token: string): Promise<Response> {
  const form = new FormData();
  form.append('file', file);
  try {
    return await fetch(`/api/v1/orgs/${orgId}/assets`, {
      method: 'POST',
      credentials: 'same-origin',
      headers: { Accept: 'application/json', 'x-csrf-token': token },
      body: form,
    });
  } catch {
    throw new ApiError(0, {
      code: 'service_unavailable',
      message: 'The server cannot be reached',
      details: null,
    });
  }
}

const csrfToken = async () => csrfResponseSchema.parse(await apiFetch('/auth/csrf')).csrfToken;

/**
 * A logo upload (multipart, field `file`). `apiFetch` sends JSON bodies only, so this asks for the
 * session's CSRF token the documented way and sends the form itself; the answer and any refusal
 * come back in the same shapes as every other call.
 */
async function uploadAsset(orgId: number, file: File): Promise<Asset> {
  let res = await send(orgId, file, await csrfToken());
  let data: unknown = await res.json().catch(() => null);
  if (res.status === 403 && errorBodySchema.safeParse(data).data?.error.code === 'csrf_failed') {
    res = await send(orgId, file, await csrfToken());
    data = await res.json().catch(() => null);
  }
  if (!res.ok) {
    const parsed = errorBodySchema.safeParse(data);
    throw new ApiError(
      res.status,
      parsed.success
        ? parsed.data.error
        : { code: 'bad_request', message: `The server answered HTTP ${res.status}`, details: null },
    );
  }
  return assetSchema.parse(data);
}

export function useUploadLogo(orgId: number) {
  return useMutation({ mutationFn: (file: File) => uploadAsset(orgId, file) });
}
