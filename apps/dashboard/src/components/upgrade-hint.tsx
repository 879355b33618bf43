import { can } from '@wickstone/contracts';
import { isApiError } from '../lib/api';
import { useOrg } from '../lib/org-context';
import { orgPath } from '../nav';
import { TextLink } from './ui';

/** Under a refusal for the plan's limits: the way to a larger plan for the owner, whom to ask for anyone else. */
export function UpgradeHint({ error }: { error: unknown }) {
  const { orgId, role } = useOrg();
  if (!isApiError(error, 402, 'plan_limit')) return null;
  return can(role, 'billing:manage') ? (
    <p className="text-sm">
      <TextLink to={orgPath(orgId, 'billing')}>See the plans and move to a larger one</TextLink>
    </p>
  ) : (
    <p className="text-sm text-ink-soft">The firm&apos;s owner can move it to a larger plan.</p>
  );
}
