import { useCallback, useEffect, useRef } from 'react';
import { useSearchParams } from 'react-router';

/*
 * The usage and leads screens keep their filters in the URL, so a filtered view can be bookmarked
 * or sent to a colleague; these helpers turn the URL's parameters into the API's query strings.
 */

const DAY_MS = 86_400_000;

/** A UTC calendar day, `YYYY-MM-DD`, `offsetDays` from today. */
export function utcDay(offsetDays = 0, now = Date.now()): string {
  return new Date(now + offsetDays * DAY_MS).toISOString().slice(0, 10);
}

/** The default period: the last 30 days, today included. */
export function defaultRange(now = Date.now()): { from: string; to: string } {
  return { from: utcDay(-29, now), to: utcDay(0, now) };
}

/** The page number in the URL, 1 when missing or not a whole number of at least 1. */
export function pageParam(params: URLSearchParams): number {
  const n = Number(params.get('page') ?? '1');
  return Number.isInteger(n) && n >= 1 ? n : 1;
}

/** Only the named parameters that have a value, in a stable order (it is part of a query key). */
export function pick(
  params: URLSearchParams,
  names: readonly string[],
  extra: Record<string, string> = {},
): string {
  const out = new URLSearchParams();
  for (const name of names) {
    const v = extra[name] ?? params.get(name);
    if (v) out.set(name, v);
  }
  for (const [k, v] of Object.entries(extra)) if (!names.includes(k) && v) out.set(k, v);
  return out.toString();
}

/** The URL's parameters with one changed (empty removes it); any change of filter goes back to page 1. */
export function withParam(params: URLSearchParams, name: string, value: string): URLSearchParams {
  const next = new URLSearchParams(params);
  if (value) next.set(name, value);
  else next.delete(name);
  if (name !== 'page') next.delete('page');
  return next;
}

/**
 * The URL's parameters and a setter for one of them. The router applies a change only when its
 * navigation ends, so two changes in quick succession would each start from the same old
 * parameters and the first would be lost; the setter starts from the last one asked for instead.
 */
export function useFilterParams(): [URLSearchParams, (name: string, value: string) => void] {
  const [params, setParams] = useSearchParams();
  const latest = useRef(params);
  useEffect(() => {
    latest.current = params;
  }, [params]);
  const set = useCallback(
    (name: string, value: string) => {
      const next = withParam(latest.current, name, value);
      latest.current = next;
      setParams(next);
    },
    [setParams],
  );
  return [params, set];
}

/** The page number in the URL and a way to move to another page (page 1 drops the parameter). */
export function usePageParam(): [number, (page: number) => void] {
  const [params, set] = useFilterParams();
  return [pageParam(params), (page) => set('page', page === 1 ? '' : String(page))];
}
