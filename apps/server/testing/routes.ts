import type { RouteRecord } from '../src/http/routes.js';

/**
 * For the generated route tests: a concrete URL for a route pattern. Organisation ids come from
 * `values`; any other id (`...Id`) or token defaults to one that exists nowhere, so a probe that
 * gets past the access checks cannot change anything. A route with another kind of parameter
 * fails loudly, so it gets a value here rather than a silent skip.
 */
export function probeUrl(route: RouteRecord, values: Record<string, string | number> = {}): string {
  const defaults: Record<string, string> = {
    orgId: '4000000000',
    userId: '4000000000',
    invitationId: '4000000000',
    widgetId: '4000000000',
    leadId: '4000000000',
    revisionId: '4000000000',
    runId: '00000000-0000-4000-8000-000000000000',
    token: 'x'.repeat(43),
  };
  return route.path.replace(/:([A-Za-z]+)/g, (_m, name: string) => {
    const v = values[name] ?? defaults[name];
    if (v === undefined)
      throw new Error(`${route.path}: no probe value for :${name}; add one in http/probe.ts`);
    return encodeURIComponent(String(v));
  });
}

export const routeKey = (r: Pick<RouteRecord, 'method' | 'path'>): string =>
  `${r.method.toUpperCase()} ${r.path}`;
