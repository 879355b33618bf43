import { QueryTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

/*
 * Runs are stored in the order of (organisation, time) instead of their client-made random UUID.
 * InnoDB keeps a table's rows in primary-key order, so with the UUID as the key every new run
 * landed on a random page and every read in time order (the CSV export, the purge, a GROUP BY over
 * a period) fetched one random page per row: at a million runs and a buffer pool smaller than the
 * table, an export read 1,000 rows in seconds. Keyed by time, new runs are appended and a period is
 * one contiguous range. The UUID stays unique, so a retried report is still stored once.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(
    `ALTER TABLE runs
       DROP PRIMARY KEY,
       ADD PRIMARY KEY (organization_id, created_at, id),
       ADD UNIQUE KEY runs_id_unique (id),
       DROP INDEX runs_organization_id_created_at`,
    { type: QueryTypes.RAW },
  );
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(
    `ALTER TABLE runs
       DROP PRIMARY KEY,
       ADD PRIMARY KEY (id),
       DROP INDEX runs_id_unique,
       ADD INDEX runs_organization_id_created_at (organization_id, created_at)`,
    { type: QueryTypes.RAW },
  );
};
