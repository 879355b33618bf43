import type { Connection } from 'mariadb';
import type { Sequelize } from 'sequelize';

/**
 * A SELECT for an export, read the cheapest way the connector offers: each row an array of its
 * columns in the query's order, every value as MariaDB sent it in text (DATETIME as
 * `YYYY-MM-DD hh:mm:ss.fff`, JSON as its text), integers as numbers. Sequelize's own query path
 * casts each value through a callback of its own and builds an object per row; at a million rows
 * that was a fifth of the export's time in the profile. The connection comes from the pool of
 * `sequelize` (the read replica's when it has one) for this one query and goes back to it at once,
 * so a slow download never holds one. Values go through the connector's `?` placeholders.
 */
export async function selectRows(
  sequelize: Sequelize,
  sql: string,
  params: readonly unknown[],
): Promise<unknown[][]> {
  const pool = sequelize.connectionManager as unknown as {
    getConnection(options: { type: 'SELECT' }): Promise<Connection>;
    releaseConnection(conn: Connection): void;
  };
  const conn = await pool.getConnection({ type: 'SELECT' });
  try {
    return await conn.query<unknown[][]>(
      {
        sql,
        rowsAsArray: true,
        // Sequelize's per-value cast is a connection option; this query goes without it.
        typeCast: undefined,
        dateStrings: true,
        autoJsonMap: false,
      },
      params,
    );
  } finally {
    pool.releaseConnection(conn);
  }
}
