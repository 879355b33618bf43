import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

// The project block a visitor fills before downloading a run's calculation sheet (project or site,
// prepared for, a note) is kept with the run: later copies of the sheet (the analyst's, the
// e-mailed one) print it again, and it goes when the run is purged under retention.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('runs', 'sheet_project', { type: DataTypes.JSON, allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  // Raw, with its type: the connector's removeColumn result trips Sequelize's MariaDB formatter.
  await qi.sequelize.query('ALTER TABLE runs DROP COLUMN sheet_project', { type: QueryTypes.UPDATE });
};
