import { useEffect } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Outlet, useParams } from 'react-router';
import { OrgContext } from '../lib/org-context';
import { rememberOrg } from '../lib/session';
import { usePageTitle } from '../lib/use-page-title';
import { meQuery } from '../queries/session';
import { TextLink } from '../components/ui';

/** `/orgs/:orgId/*`: only for members; anyone else sees the same "not here" as the server's 404. */
export function OrgLayout() {
  const orgId = Number(useParams().orgId);
  const me = useQuery(meQuery()).data;
  const membership = me?.memberships.find((m) => m.organizationId === orgId);
  useEffect(() => {
    if (membership) rememberOrg(membership.organizationId);
  }, [membership]);

  if (!me || !membership) return <OrgNotFound />;
  return (
    <OrgContext.Provider
      value={{
        orgId,
        organizationName: membership.organizationName,
        role: membership.role,
        userId: me.user.id,
      }}
    >
      <Outlet />
    </OrgContext.Provider>
  );
}

function OrgNotFound() {
  usePageTitle('Organisation not found');
  return (
    <section className="space-y-3">
      <h1 className="text-2xl font-bold tracking-tight">Organisation not found</h1>
      <p className="max-w-xl text-ink-soft">
        There is no organisation at this address that you belong to. If you were removed from it, an owner or
        admin can invite you again.
      </p>
      <p>
        <TextLink to="/orgs">See your organisations</TextLink>
      </p>
    </section>
  );
}
