import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import type { AuditService } from './audit/service.js';
import type { Config } from './config.js';
import type { Mailer } from './mail/mailer.js';

/** What a service that writes, audits and mails is built from (createApp hands these over). */
export interface ServiceDeps {
  config: Config;
  sequelize: Sequelize;
  audit: AuditService;
  mailer: Mailer;
  logger: Logger;
}
