import type { Sequelize } from 'sequelize';
import { AuditEvent } from './audit-event.js';
import { BillingAccount } from './billing-account.js';
import { Invitation } from './invitation.js';
import { Membership } from './membership.js';
import { Organization } from './organization.js';
import { OrganizationSetting } from './organization-setting.js';
import { PasswordReset } from './password-reset.js';
import { SessionRevocation } from './session-revocation.js';
import { User } from './user.js';
import { Asset } from './asset.js';
import { Lead } from './lead.js';
import { LeadNote } from './lead-note.js';
import { Run } from './run.js';
import { Widget } from './widget.js';
import { WidgetRevision } from './widget-revision.js';

export type { AuditEventType } from './audit-event.js';
export {
  Asset,
  AuditEvent,
  BillingAccount,
  Invitation,
  Lead,
  LeadNote,
  Membership,
  Organization,
  OrganizationSetting,
  PasswordReset,
  Run,
  SessionRevocation,
  User,
  Widget,
  WidgetRevision,
};

/** Bind every model to this connection and declare the associations between them. */
export function initModels(sequelize: Sequelize): void {
  Organization.initModel(sequelize);
  User.initModel(sequelize);
  Membership.initModel(sequelize);
  Invitation.initModel(sequelize);
  PasswordReset.initModel(sequelize);
  SessionRevocation.initModel(sequelize);
  AuditEvent.initModel(sequelize);
  Asset.initModel(sequelize);
  Widget.initModel(sequelize);
  WidgetRevision.initModel(sequelize);
  Run.initModel(sequelize);
  Lead.initModel(sequelize);
  LeadNote.initModel(sequelize);
  OrganizationSetting.initModel(sequelize);
  BillingAccount.initModel(sequelize);

  Organization.hasMany(Membership, { foreignKey: 'organizationId', as: 'memberships' });
  Membership.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });

  Invitation.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
  Invitation.belongsTo(User, { foreignKey: 'invitedByUserId', as: 'invitedBy' });
  PasswordReset.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  AuditEvent.belongsTo(User, { foreignKey: 'actorUserId', as: 'actor' });
  AuditEvent.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
  LeadNote.belongsTo(User, { foreignKey: 'authorUserId', as: 'author' });
}
