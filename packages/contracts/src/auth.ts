import { z } from 'zod';
import { roles } from './permissions.js';
import { displayNameSchema } from './text.js';

const utf8 = new TextEncoder();

export const emailSchema = z
  .string()
  .trim()
  .max(254, 'At most 254 characters')
  .pipe(z.email('Enter a valid e-mail address'))
  .transform((e) => e.toLowerCase());

/**
 * bcrypt reads at most 72 bytes: a longer password is refused, not silently truncated.
 * The server adds the common-password check (the list is too large for the browser bundle).
 */
export const newPasswordSchema = z
  .string()
  .min(8, 'At least 8 characters')
  .refine((p) => utf8.encode(p).length <= 72, 'At most 72 bytes (bcrypt ignores the rest)');

export const personNameSchema = displayNameSchema(120);
export const roleSchema = z.enum(roles);

export const signupBodySchema = z.strictObject({
  organizationName: displayNameSchema(120, 2),
  name: personNameSchema,
  email: emailSchema,
  password: newPasswordSchema,
});
export type SignupBody = z.infer<typeof signupBodySchema>;

export const loginBodySchema = z.strictObject({
  email: emailSchema,
  password: z.string().min(1, 'Required').max(1024, 'Too long'),
});
export type LoginBody = z.infer<typeof loginBodySchema>;

export const forgotPasswordBodySchema = z.strictObject({ email: emailSchema });
export const resetPasswordBodySchema = z.strictObject({
  token: z.string().min(20).max(200),
  password: newPasswordSchema,
});

export const updateAccountBodySchema = z
  .strictObject({
    name: personNameSchema.optional(),
    currentPassword: z.string().min(1).max(1024).optional(),
    newPassword: newPasswordSchema.optional(),
  })
  .refine((b) => b.newPassword === undefined || b.currentPassword !== undefined, {
    message: 'Required to set a new password',
    path: ['currentPassword'],
  });

export const userSchema = z.object({ id: z.number().int(), name: z.string(), email: z.string() });
export const membershipSchema = z.object({
  organizationId: z.number().int(),
  organizationName: z.string(),
  role: roleSchema,
});
export const meResponseSchema = z.object({ user: userSchema, memberships: z.array(membershipSchema) });
export type MeResponse = z.infer<typeof meResponseSchema>;

export const csrfResponseSchema = z.object({ csrfToken: z.string() });

export const orgParamsSchema = z.strictObject({ orgId: z.coerce.number().int().positive() });
export const memberParamsSchema = z.strictObject({
  orgId: z.coerce.number().int().positive(),
  userId: z.coerce.number().int().positive(),
});

export const invitationParamsSchema = z.strictObject({
  orgId: z.coerce.number().int().positive(),
  invitationId: z.coerce.number().int().positive(),
});

/** `GET /orgs/:orgId`: the organisation and the caller's role in it. */
export const organizationResponseSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  slug: z.string(),
  role: roleSchema,
});
export type OrganizationResponse = z.infer<typeof organizationResponseSchema>;

export const memberSchema = z.object({
  userId: z.number().int(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  joinedAt: z.string(),
});
export const invitationSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  role: roleSchema,
  invitedBy: z.string(),
  expiresAt: z.string(),
  createdAt: z.string(),
});
export const membersResponseSchema = z.object({
  items: z.array(memberSchema),
  invitations: z.array(invitationSchema),
});
export type Member = z.infer<typeof memberSchema>;
export type MembersResponse = z.infer<typeof membersResponseSchema>;

export const inviteBodySchema = z.strictObject({ email: emailSchema, role: roleSchema });
export const memberRoleBodySchema = z.strictObject({ role: roleSchema });

export const invitationTokenParamsSchema = z.strictObject({ token: z.string().min(20).max(200) });
/** A new user gives a name and password; an existing user gives their current password (or is signed in as them). */
export const acceptInvitationBodySchema = z.strictObject({
  name: personNameSchema.optional(),
  password: z.string().min(1).max(1024).optional(),
});
export const invitationPreviewSchema = z.object({
  email: z.string(),
  role: roleSchema,
  organizationName: z.string(),
  existingUser: z.boolean(),
  expiresAt: z.string(),
});

export const pageQuerySchema = z.strictObject({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});

export const auditEventTypes = [
  'auth.login',
  'auth.login_failed',
  'auth.logout',
  'auth.signup',
  'auth.password_reset',
  'member.invited',
  'member.joined',
  'member.role_changed',
  'member.removed',
  'widget.created',
  'widget.updated',
  'widget.release_pinned',
  'widget.key_rotated',
  'widget.key_overlap_ended',
  'lead.updated',
  'lead.note_added',
  'lead.erased',
  'retention.changed',
  'billing.plan_changed',
  'billing.cancel_requested',
] as const;
export const auditEntrySchema = z.object({
  id: z.number().int(),
  type: z.enum(auditEventTypes),
  actor: z.object({ id: z.number().int(), name: z.string(), email: z.string() }).nullable(),
  subject: z.string().nullable(),
  ip: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  createdAt: z.string(),
});
export const auditResponseSchema = z.object({ items: z.array(auditEntrySchema), total: z.number().int() });
export type AuditEntry = z.infer<typeof auditEntrySchema>;

export const devMailQuerySchema = z.strictObject({
  to: emailSchema.optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

export const devMailMessageSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  links: z.array(z.string()),
});
export const devMailResponseSchema = z.object({ items: z.array(devMailMessageSchema) });
export type DevMailMessage = z.infer<typeof devMailMessageSchema>;
