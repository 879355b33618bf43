import { roles, type AuditEntry, type Role } from '@wickstone/contracts';

export const roleLabel: Record<Role, string> = {
  owner: 'Owner',
  admin: 'Admin',
  analyst: 'Analyst',
  developer: 'Developer',
};

/** One line on what each role is for, shown where a role is chosen. */
export const roleSummary: Record<Role, string> = {
  owner: 'Everything an admin does, plus handing out and taking back the owner role.',
  admin: 'Sets up widgets, brand and request forms; manages the team.',
  analyst: 'Reviews usage and answers the enquiries.',
  developer:
    'Pins widgets to releases after previewing the change, keeps the sites allowed to embed them and replaces their keys.',
};

export const roleOptions = roles.map((r) => ({ value: r, label: roleLabel[r] }));

export const auditLabel: Record<AuditEntry['type'], string> = {
  'auth.login': 'Signed in',
  'auth.login_failed': 'Sign-in refused',
  'auth.logout': 'Signed out',
  'auth.signup': 'Organisation created',
  'auth.password_reset': 'Password reset',
  'member.invited': 'Invitation sent',
  'member.joined': 'Joined the team',
  'member.role_changed': 'Role changed',
  'member.removed': 'Removed from the team',
  'widget.created': 'Widget created',
  'widget.updated': 'Widget changed',
  'widget.release_pinned': 'Widget release pin moved',
  'widget.key_rotated': 'Widget embed key replaced',
  'widget.key_overlap_ended': 'Replaced embed key stopped early',
  'lead.updated': 'Enquiry updated',
  'lead.note_added': 'Note added to an enquiry',
  'lead.erased': 'Enquirer’s personal data erased',
  'retention.changed': 'Retention period changed',
  'billing.plan_changed': 'Plan changed',
  'billing.cancel_requested': 'Plan set to end',
};

const dateTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
const dateOnly = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium' });

export function formatDateTime(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : dateTime.format(d);
}

export function formatDate(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : dateOnly.format(d);
}
