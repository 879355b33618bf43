import type { ReactNode } from 'react';
import { can, permissions, type Permission } from '@wickstone/contracts';
import { roleLabel } from '../lib/labels';
import { orgPath } from '../nav';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import { TextLink } from './ui';

/** Renders its screen only for roles that hold the permission; the server checks again on every request. */
export function RequirePermission({ permission, children }: { permission: Permission; children: ReactNode }) {
  const { role } = useOrg();
  return can(role, permission) ? children : <NotAllowed permission={permission} />;
}

function NotAllowed({ permission }: { permission: Permission }) {
  usePageTitle('Not available for your role');
  const { role, orgId, organizationName } = useOrg();
  const allowed = permissions[permission].map((r) => roleLabel[r]);
  return (
    <section
      aria-labelledby="not-allowed-title"
      className="max-w-xl space-y-4 rounded-lg border border-warn/40 bg-warn-tint px-6 py-6"
    >
      <h1 id="not-allowed-title" className="text-xl font-bold tracking-tight text-warn">
        Not available for your role
      </h1>
      <p>
        You are <strong>{roleLabel[role]}</strong> in {organizationName}. This screen is open to the{' '}
        {allowed.length > 1 ? `${allowed.slice(0, -1).join(', ')} and ${allowed.at(-1)}` : allowed[0]} roles.
      </p>
      <p className="text-sm text-ink-soft">
        If your work needs it, ask an owner or admin to change your role.
      </p>
      <p>
        <TextLink to={orgPath(orgId)}>Back to the overview</TextLink>
      </p>
    </section>
  );
}
