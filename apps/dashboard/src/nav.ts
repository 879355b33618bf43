import type { Permission } from '@wickstone/contracts';

/**
 * The signed-in navigation. Each entry names the permission that shows it; later screens (widgets,
 * usage, leads, embed keys) are added here and nowhere else. Hiding is a courtesy: the server decides.
 */
export interface NavEntry {
  label: string;
  /** The path under `/orgs/:orgId`, '' for the overview. */
  path: string;
  permission: Permission;
}

export const orgNav: readonly NavEntry[] = [
  { label: 'Overview', path: '', permission: 'org:read' },
  { label: 'Widgets', path: 'widgets', permission: 'widgets:read' },
  { label: 'Usage', path: 'usage', permission: 'usage:read' },
  { label: 'Enquiries', path: 'leads', permission: 'leads:read' },
  { label: 'Team', path: 'team', permission: 'members:read' },
  { label: 'Audit log', path: 'audit', permission: 'audit:read' },
  { label: 'Data retention', path: 'settings/retention', permission: 'org:read' },
  { label: 'Billing', path: 'billing', permission: 'billing:manage' },
];

export function orgPath(orgId: number, path = ''): string {
  return path ? `/orgs/${orgId}/${path}` : `/orgs/${orgId}`;
}
