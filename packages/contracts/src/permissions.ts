/**
 * The one permission table. The server checks it on every route; the dashboard imports it to hide
 * what a role may not do (the server still decides).
 */
export const roles = ['owner', 'admin', 'analyst', 'developer'] as const;
export type Role = (typeof roles)[number];

export const permissions = {
  'org:read': ['owner', 'admin', 'analyst', 'developer'],
  'members:read': ['owner', 'admin', 'analyst', 'developer'],
  'members:manage': ['owner', 'admin'],
  'audit:read': ['owner', 'admin'],
  'widgets:read': ['owner', 'admin', 'analyst', 'developer'],
  'widgets:write': ['owner', 'admin'],
  'assets:write': ['owner', 'admin'],
  'embed:manage': ['owner', 'admin', 'developer'],
  'releases:pin': ['owner', 'admin', 'developer'],
  'usage:read': ['owner', 'admin', 'analyst', 'developer'],
  'leads:read': ['owner', 'admin', 'analyst'],
  'leads:write': ['owner', 'admin', 'analyst'],
  'leads:erase': ['owner', 'admin', 'analyst'],
  'settings:write': ['owner', 'admin'],
  /** The plan, payments and invoices: the owner alone, since it commits the firm to paying. */
  'billing:manage': ['owner'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof permissions;

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return role != null && (permissions[permission] as readonly Role[]).includes(role);
}

/** Only an owner may hand out or take away the owner role. */
export function canAssignRole(actor: Role, target: Role): boolean {
  if (!can(actor, 'members:manage')) return false;
  return target !== 'owner' || actor === 'owner';
}
