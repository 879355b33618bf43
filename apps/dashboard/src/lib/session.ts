import type { MeResponse } from '@wickstone/contracts';

const lastOrgKey = 'wickstone.lastOrg';

/** Remember the organisation last opened, so sign-in and /account lead back to it. */
export function rememberOrg(orgId: number) {
  try {
    localStorage.setItem(lastOrgKey, String(orgId));
  } catch {
    // Storage may be off (private mode): falling back to the first membership is fine.
  }
}

function lastOrg(): number | null {
  try {
    const v = Number(localStorage.getItem(lastOrgKey));
    return Number.isInteger(v) && v > 0 ? v : null;
  } catch {
    return null;
  }
}

/** The organisation to show by default: the last one opened if still a member, else the first. */
export function defaultOrgId(me: MeResponse): number | null {
  const last = lastOrg();
  if (last && me.memberships.some((m) => m.organizationId === last)) return last;
  return me.memberships[0]?.organizationId ?? null;
}

/** Where a signed-in person lands when nothing else was asked for. */
export function homeFor(me: MeResponse): string {
  const orgId = defaultOrgId(me);
  return orgId ? `/orgs/${orgId}` : '/orgs';
}

/** A `next` parameter is followed only when it is a path on this site (no `//evil.example`). */
export function safeNext(next: string | null): string | null {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return null;
  return next;
}

export function loginPath(next?: string): string {
  return next ? `/login?next=${encodeURIComponent(next)}` : '/login';
}
