import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { auditResponseSchema } from '@wickstone/contracts';
import { apiFetch } from '../lib/api';

export const auditQuery = (orgId: number, page: number, pageSize: number) =>
  queryOptions({
    queryKey: ['orgs', orgId, 'audit', { page, pageSize }],
    queryFn: async () =>
      auditResponseSchema.parse(await apiFetch(`/orgs/${orgId}/audit?page=${page}&pageSize=${pageSize}`)),
    // Keep the current page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });
