import { QueryTypes, type Sequelize } from 'sequelize';
import type { HealthResponse } from '@wickstone/contracts';
import { AppError } from '../errors.js';

const DB_TIMEOUT_MS = 2_500;

export interface HealthService {
  check(): Promise<HealthResponse>;
}

export function createHealthService(sequelize: Sequelize, version: string): HealthService {
  const startedAt = Date.now();
  return {
    async check() {
      const t0 = performance.now();
      try {
        let timer: NodeJS.Timeout | undefined;
        const timeout = new Promise<never>((_, reject) => {
          timer = setTimeout(() => reject(new Error('database round trip timed out')), DB_TIMEOUT_MS);
        });
        try {
          await Promise.race([sequelize.query('SELECT 1 AS ok', { type: QueryTypes.SELECT }), timeout]);
        } finally {
          clearTimeout(timer);
        }
      } catch (err) {
        throw new AppError(
          'service_unavailable',
          'The database is not answering',
          {
            database: {
              status: 'down',
              reason: err instanceof Error ? err.message.slice(0, 200) : 'unknown',
            },
          },
          { cause: err },
        );
      }
      const roundTripMs = Math.round((performance.now() - t0) * 100) / 100;
      return {
        status: 'ok',
        version,
        uptimeS: Math.round((Date.now() - startedAt) / 1000),
        database: { status: 'up', roundTripMs },
      };
    },
  };
}
