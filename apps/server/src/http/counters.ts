import { createHash } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';

/** One counter's state: hits in its current window, and how long until the window ends. */
export interface CounterState {
  hits: number;
  /** Milliseconds until this window ends and the count starts again from nothing. */
  resetInMs: number;
  /** Milliseconds since the last hit. */
  sinceLastMs: number;
}

/**
 * Fixed-window counters in MariaDB (`rate_limit_counters`), so every server process over the one
 * database counts together. A hit is one atomic upsert (the row lock orders concurrent hits, from
 * any process); the database's clock decides windows, so processes whose clocks differ agree.
 */
export interface Counters {
  /** Count one hit and answer the count including it. */
  hit(key: string, windowMs: number): Promise<CounterState>;
  /** The current window's count, or null when there is none (never counted or ended). */
  peek(key: string): Promise<CounterState | null>;
  /** Take back one hit (a request that, in the end, does not count). */
  undo(key: string): Promise<void>;
  reset(key: string): Promise<void>;
  /** Delete rows whose window ended: what is left is what still counts. */
  sweep(): Promise<number>;
}

const hashKey = (key: string): string => createHash('sha256').update(key).digest('hex');

const STATE = `SELECT hits,
  TIMESTAMPDIFF(MICROSECOND, NOW(3), window_ends_at) DIV 1000 AS reset_in_ms,
  TIMESTAMPDIFF(MICROSECOND, last_hit_at, NOW(3)) DIV 1000 AS since_last_ms
  FROM rate_limit_counters WHERE key_hash = ?`;

interface StateRow {
  hits: number;
  reset_in_ms: number | bigint | string;
  since_last_ms: number | bigint | string;
}

const toState = (r: StateRow): CounterState => ({
  hits: Number(r.hits),
  resetInMs: Math.max(0, Number(r.reset_in_ms)),
  sinceLastMs: Math.max(0, Number(r.since_last_ms)),
});

/** One sweep per this many hits, about: ended rows never pile up, and no timer is needed. */
const SWEEP_EVERY = 500;

export function createCounters(sequelize: Sequelize): Counters {
  let sinceSweep = 0;
  const counters: Counters = {
    async hit(key, windowMs) {
      const k = hashKey(key);
      const state = await sequelize.transaction(async (transaction) => {
        // Assignments apply left to right: `hits` reads the old window end, then the window moves.
        await sequelize.query(
          `INSERT INTO rate_limit_counters (key_hash, hits, window_ends_at, last_hit_at)
           VALUES (?, 1, NOW(3) + INTERVAL ? MICROSECOND, NOW(3))
           ON DUPLICATE KEY UPDATE
             hits = IF(window_ends_at <= NOW(3), 1, hits + 1),
             window_ends_at = IF(window_ends_at <= NOW(3), VALUES(window_ends_at), window_ends_at),
             last_hit_at = NOW(3)`,
          { replacements: [k, Math.round(windowMs) * 1000], type: QueryTypes.INSERT, transaction },
        );
        const rows = await sequelize.query<StateRow>(STATE, {
          replacements: [k],
          type: QueryTypes.SELECT,
          transaction,
        });
        return toState(rows[0] as StateRow);
      });
      if (++sinceSweep >= SWEEP_EVERY) {
        sinceSweep = 0;
        void counters.sweep().catch(() => undefined);
      }
      return state;
    },

    async peek(key) {
      const rows = await sequelize.query<StateRow>(`${STATE} AND window_ends_at > NOW(3)`, {
        replacements: [hashKey(key)],
        type: QueryTypes.SELECT,
      });
      return rows[0] ? toState(rows[0]) : null;
    },

    async undo(key) {
      await sequelize.query(
        'UPDATE rate_limit_counters SET hits = hits - 1 WHERE key_hash = ? AND hits > 0 AND window_ends_at > NOW(3)',
        { replacements: [hashKey(key)], type: QueryTypes.UPDATE },
      );
    },

    async reset(key) {
      await sequelize.query('DELETE FROM rate_limit_counters WHERE key_hash = ?', {
        replacements: [hashKey(key)],
        type: QueryTypes.DELETE,
      });
    },

    async sweep() {
      const result = (await sequelize.query(
        'DELETE FROM rate_limit_counters WHERE window_ends_at < NOW(3) LIMIT 5000',
        { type: QueryTypes.DELETE },
      )) as unknown;
      return typeof result === 'number' ? result : 0;
    },
  };
  return counters;
}

/**
 * express-rate-limit's store interface over the shared counters: one store per limiter, its
 * `prefix` keeping limiters' keys apart.
 */
export class SharedCounterStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;

  constructor(
    private readonly counters: Counters,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private info(s: CounterState): ClientRateLimitInfo {
    return { totalHits: s.hits, resetTime: new Date(Date.now() + s.resetInMs) };
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const s = await this.counters.peek(`${this.prefix}${key}`);
    return s ? this.info(s) : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    return this.info(await this.counters.hit(`${this.prefix}${key}`, this.windowMs));
  }

  async decrement(key: string): Promise<void> {
    await this.counters.undo(`${this.prefix}${key}`);
  }

  async resetKey(key: string): Promise<void> {
    await this.counters.reset(`${this.prefix}${key}`);
  }
}
