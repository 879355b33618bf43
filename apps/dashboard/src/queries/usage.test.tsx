// @vitest-environment happy-dom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { refreshCsrf } from '../lib/api';
import { leadListQuery, runListQuery, usageSummaryQuery, useEraseLead } from './usage';

const json = (body: unknown) =>
  new Response(JSON.stringify(body), { status: 200, headers: { 'content-type': 'application/json' } });

afterEach(() => vi.unstubAllGlobals());

describe('a lead change', () => {
  it('marks the lead lists, the runs and the usage summary stale (the summary counts leads)', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async (input: RequestInfo | URL) =>
        String(input).endsWith('/auth/csrf') ? json({ csrfToken: 't' }) : new Response(null, { status: 204 }),
      ),
    );
    await refreshCsrf();
    const client = new QueryClient();
    const keys: (readonly unknown[])[] = [
      usageSummaryQuery(1, 'from=2026-11-01').queryKey,
      leadListQuery(1, 'page=1').queryKey,
      runListQuery(1, 'page=1').queryKey,
    ];
    for (const key of keys) client.setQueryData(key, {});
    const other: readonly unknown[] = usageSummaryQuery(2, 'from=2026-11-01').queryKey;
    client.setQueryData(other, {});
    const wrapper = ({ children }: { children: ReactNode }) => (
      <QueryClientProvider client={client}>{children}</QueryClientProvider>
    );
    const { result } = renderHook(() => useEraseLead(1, 5), { wrapper });
    result.current.mutate(undefined);
    await waitFor(() => expect(result.current.isSuccess).toBe(true));
    for (const key of keys) expect(client.getQueryState(key)?.isInvalidated, String(key)).toBe(true);
    expect(client.getQueryState(other)?.isInvalidated).toBe(false);
  });
});
