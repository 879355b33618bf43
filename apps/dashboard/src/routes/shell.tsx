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
import { BrandLink, ContentsToggle, LiveMessage, NumberBadge } from '../components/ui';
import type { NoticeState } from './login';

/* A register of the firm's pages: ruled rows, each numbered like the sheets of a report. */
const navLinkClass = ({ isActive }: { isActive: boolean }) =>
  [
    'flex items-center gap-3 border-b border-line px-2 py-2 text-sm transition-colors',
    isActive ? 'font-bold text-ink' : 'font-semibold text-ink-soft hover:bg-paper-deep hover:text-ink',
  ].join(' ');

const titleCell = 'flex min-w-0 flex-col justify-center px-4 py-2 sm:px-5';
const titleLabel = 'text-xs font-semibold tracking-wider text-ink-soft uppercase';

/** The frame around every signed-in screen: whose organisation, what this role may open, who is signed in. */
export function AppShell() {
  const me = useQuery(meQuery());
  const location = useLocation();
  const navigate = useNavigate();
  const client = useQueryClient();
  const logout = useLogout();
  const [signingOut, setSigningOut] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [navOpen, setNavOpen] = useState(false);
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

  const entries = membership && role ? orgNav.filter((entry) => can(role, entry.permission)) : [];
  const links: { key: string; to: string; label: string; end: boolean }[] = [
    ...entries.map((entry) => ({
      key: entry.path || 'overview',
      to: orgPath(membership!.organizationId, entry.path),
      label: entry.label,
      end: entry.path === '',
    })),
    { key: 'account', to: '/account', label: 'Your account', end: false },
    ...(account.memberships.length > 1 || !membership
      ? [{ key: 'orgs', to: '/orgs', label: 'Organisations', end: true }]
      : []),
  ];
  const here = links.find((l) =>
    l.end
      ? location.pathname === l.to
      : location.pathname === l.to || location.pathname.startsWith(`${l.to}/`),
  );

  return (
    <div className="min-h-screen">
      <a
        href="#main"
        className="sr-only z-50 rounded-md bg-card px-4 py-2 font-semibold text-brand focus:not-sr-only focus:fixed focus:top-2 focus:left-2"
      >
        Skip to content
      </a>
      {/* The frame reads like the title block of a drawing sheet: who, which firm, in what role. */}
      <header className="border-b-2 border-ink bg-card">
        <div className="mx-auto flex max-w-7xl flex-wrap items-stretch sm:flex-nowrap">
          <div className="flex items-center px-4 py-2 sm:px-6">
            <BrandLink tone="light" nameClassName="hidden sm:inline" />
          </div>
          <dl className="order-last flex w-full min-w-0 border-t border-line sm:order-none sm:w-auto sm:flex-1 sm:border-t-0 sm:border-l">
            <div className={`${titleCell} flex-1`}>
              <dt className={titleLabel}>Organisation</dt>
              <dd className="min-w-0">
                {membership ? (
                  <OrgSwitcher me={account} orgId={membership.organizationId} section={section} />
                ) : (
                  <span className="text-ink-soft">None yet</span>
                )}
              </dd>
            </div>
            {membership ? (
              <div className={`${titleCell} flex-none border-l border-line`}>
                <dt className={titleLabel}>Role</dt>
                <dd className="font-semibold">{roleLabel[membership.role]}</dd>
              </div>
            ) : null}
            <div className={`${titleCell} hidden flex-none border-l border-line md:flex`}>
              <dt className={titleLabel}>Signed in</dt>
              <dd className="min-w-0">
                <Link to="/account" className="block max-w-[14rem] truncate font-semibold hover:underline">
                  {account.user.name}
                </Link>
              </dd>
            </div>
          </dl>
          <div className="ml-auto flex items-center border-l border-line px-4 py-2 sm:px-5">
            <button
              type="button"
              onClick={signOut}
              disabled={logout.isPending}
              className="rounded-md px-2 py-1 text-sm font-semibold text-brand underline decoration-brand/30 underline-offset-4 hover:decoration-brand disabled:opacity-60"
            >
              {logout.isPending ? 'Signing out…' : 'Sign out'}
            </button>
          </div>
        </div>
      </header>

      <div className="mx-auto max-w-7xl md:grid md:grid-cols-[14rem_1fr] md:gap-8 md:px-6">
        <nav aria-label="Main" className="border-b border-line bg-paper md:border-b-0 md:py-8">
          {/* On a phone the contents fold behind one button that names where you are and how many pages there are. */}
          <ContentsToggle
            open={navOpen}
            onToggle={() => setNavOpen((o) => !o)}
            controls="main-contents"
            kicker={`Contents · ${links.length} pages`}
            here={here?.label ?? 'Choose a page'}
            className="px-4 py-3 md:hidden"
          />
          <p className="hidden px-3 pb-2 text-xs font-semibold tracking-wider text-ink-soft uppercase md:block">
            Contents
          </p>
          <ol
            id="main-contents"
            className={`${navOpen ? 'block' : 'hidden'} border-t border-line px-2 pb-3 md:block md:px-0 md:pb-0`}
          >
            {links.map((l, i) => (
              <li key={l.key} className={l.key === 'account' ? 'md:mt-4' : undefined}>
                <NavLink to={l.to} end={l.end} className={navLinkClass} onClick={() => setNavOpen(false)}>
                  {({ isActive }) => (
                    <>
                      <NumberBadge n={i + 1} current={isActive} />
                      {l.label}
                    </>
                  )}
                </NavLink>
              </li>
            ))}
          </ol>
        </nav>
        <main id="main" tabIndex={-1} className="min-w-0 space-y-6 px-4 py-6 sm:px-6 md:px-0 md:py-8">
          <LiveMessage message={problem} tone="bad" />
          <Outlet />
        </main>
      </div>
    </div>
  );
}
