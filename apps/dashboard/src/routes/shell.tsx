import { useState } from 'react';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { Link, Navigate, NavLink, Outlet, useLocation, useMatch, useNavigate } from 'react-router';
import { can, type Role } from '@wickstone/contracts';
import { isApiError } from '../lib/api';
import { roleLabel } from '../lib/labels';
import { defaultOrgId, loginPath } from '../lib/session';
import { orgNav, orgPath } from '../nav';
import { meQuery, sessionChanged, useLogout } from '../queries/session';
import { LoadingState } from '../components/states';
import { OrgSwitcher } from '../components/org-switcher';
import { BrandLink, LiveMessage } from '../components/ui';
import type { NoticeState } from './login';

const navLinkClass = ({ isActive }: { isActive: boolean }) =>
  [
    'block whitespace-nowrap rounded-md px-3 py-2 text-sm font-semibold transition-colors',
    isActive ? 'bg-brand-tint text-brand-strong' : 'text-ink-soft hover:bg-paper-deep hover:text-ink',
  ].join(' ');

/** The frame around every signed-in screen: whose organisation, what this role may open, who is signed in. */
export function AppShell() {
  const me = useQuery(meQuery());
  const location = useLocation();
  const navigate = useNavigate();
  const client = useQueryClient();
  const logout = useLogout();
  const [signingOut, setSigningOut] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const orgMatch = useMatch({ path: '/orgs/:orgId/*' });
  const sectionMatch = useMatch({ path: '/orgs/:orgId/:section/*' });

  if (me.data === null) {
    // Signed out elsewhere or the session lapsed: sign in again and come back here.
    return signingOut ? null : <Navigate to={loginPath(location.pathname + location.search)} replace />;
  }
  const account = me.data;
  if (!account) return <LoadingState label="Loading your account…" />;

  const routeOrgId = Number(orgMatch?.params.orgId);
  const membership =
    account.memberships.find((m) => m.organizationId === routeOrgId) ??
    account.memberships.find((m) => m.organizationId === defaultOrgId(account));
  const role: Role | null = membership?.role ?? null;
  const section = sectionMatch?.params.section ?? '';

  const finishSignOut = async () => {
    setSigningOut(true);
    await sessionChanged(client, null);
    await navigate('/login', {
      replace: true,
      state: { notice: 'You have signed out.' } satisfies NoticeState,
    });
  };
  const signOut = () => {
    setProblem(null);
    logout.mutate(undefined, {
      onSuccess: finishSignOut,
      onError: (error) => {
        if (isApiError(error, 401)) void finishSignOut();
        else setProblem('Signing out did not go through. Check the connection and try again.');
      },
    });
  };

  return (
    <div className="min-h-screen">
      <a
        href="#main"
        className="sr-only z-50 rounded-md bg-card px-4 py-2 font-semibold text-brand focus:not-sr-only focus:fixed focus:top-2 focus:left-2"
      >
        Skip to content
      </a>
      <header className="on-dark bg-brand-strong text-brand-tint">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-5 gap-y-3 px-4 py-3 sm:px-6">
          <BrandLink nameClassName="hidden sm:inline" />
          <span aria-hidden="true" className="hidden h-6 w-px bg-brand-tint/25 sm:block" />
          {membership ? (
            <div className="order-last flex w-full min-w-0 items-center gap-3 sm:order-none sm:w-auto sm:flex-1">
              <OrgSwitcher me={account} orgId={membership.organizationId} section={section} />
              <span className="shrink-0 rounded-full border border-brand-tint/30 px-2 py-0.5 text-xs font-semibold">
                {roleLabel[membership.role]}
              </span>
            </div>
          ) : (
            <span className="order-last w-full text-brand-tint/80 sm:order-none sm:w-auto sm:flex-1">
              No organisation
            </span>
          )}
          <div className="ml-auto flex items-center gap-3">
            <Link
              to="/account"
              className="hidden max-w-[14rem] truncate rounded-md text-sm font-semibold text-card hover:underline md:inline"
            >
              {account.user.name}
            </Link>
            <button
              type="button"
              onClick={signOut}
              disabled={logout.isPending}
              className="rounded-md border border-brand-tint/40 px-3 py-1 text-sm font-semibold text-card hover:bg-brand disabled:opacity-60"
            >
              {logout.isPending ? 'Signing out…' : 'Sign out'}
            </button>
          </div>
        </div>
      </header>

      <div className="mx-auto max-w-7xl md:grid md:grid-cols-[13rem_1fr] md:gap-8 md:px-6">
        <nav aria-label="Main" className="border-b border-line bg-paper md:border-b-0 md:py-8">
          <ul className="flex gap-1 overflow-x-auto px-4 py-2 md:flex-col md:overflow-visible md:p-0">
            {membership && role
              ? orgNav
                  .filter((entry) => can(role, entry.permission))
                  .map((entry) => (
                    <li key={entry.path}>
                      <NavLink
                        to={orgPath(membership.organizationId, entry.path)}
                        end={entry.path === ''}
                        className={navLinkClass}
                      >
                        {entry.label}
                      </NavLink>
                    </li>
                  ))
              : null}
            <li className="md:mt-4 md:border-t md:border-line md:pt-4">
              <NavLink to="/account" className={navLinkClass}>
                Your account
              </NavLink>
            </li>
            {account.memberships.length > 1 || !membership ? (
              <li>
                <NavLink to="/orgs" end className={navLinkClass}>
                  Organisations
                </NavLink>
              </li>
            ) : null}
          </ul>
        </nav>
        <main id="main" tabIndex={-1} className="min-w-0 space-y-6 px-4 py-6 sm:px-6 md:px-0 md:py-8">
          <LiveMessage message={problem} tone="bad" />
          <Outlet />
        </main>
      </div>
    </div>
  );
}
