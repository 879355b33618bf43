import type { Sequelize } from 'sequelize';
import { Organization } from './organization.js';

export { Organization };

/** Bind every model to this connection and declare the associations between them. */
export function initModels(sequelize: Sequelize): void {
  Organization.initModel(sequelize);
}
