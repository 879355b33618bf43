import { queryOptions } from '@tanstack/react-query';
import type { HealthResponse } from '@wickstone/contracts';
import { apiFetch } from '../lib/api';

export const healthQuery = () =>
  queryOptions({
    queryKey: ['health'],
    queryFn: () => apiFetch<HealthResponse>('/health'),
    refetchInterval: 10_000,
    retry: false,
  });
