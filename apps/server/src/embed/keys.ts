import { QueryTypes, type Sequelize } from 'sequelize';
import { AppError } from '../errors.js';

/**
 * Keys a rotation replaced. A page with the old snippet names the old key: while it is served the
 * request is answered as the widget's (under its new key); after its date, a 410 says the key was
 * replaced and when. Current keys never come here: only a key no widget has now is looked up, so
 * the run-report path pays nothing for them. The database's clock decides, so every process agrees.
 */
export interface ReplacedKeys {
  /** The widget's current key for a replaced key still served; a 410 past its date; null for a key no widget had. */
  replacement(publicKey: string): Promise<string | null>;
  /** `use(publicKey)`, and when no live widget has that key, `use` again with its replacement. */
  withKey<T>(publicKey: string, use: (key: string) => Promise<T>): Promise<T>;
}

export function createReplacedKeys(sequelize: Sequelize): ReplacedKeys {
  const keys: ReplacedKeys = {
    async replacement(publicKey) {
      const [row] = await sequelize.query<{
        public_key: string;
        key_replaced_at: Date;
        previous_key_valid_until: Date;
        served: number;
      }>(
        `SELECT public_key, key_replaced_at, previous_key_valid_until, previous_key_valid_until > NOW(3) AS served
         FROM widgets WHERE previous_public_key = ?`,
        { replacements: [publicKey], type: QueryTypes.SELECT },
      );
      if (!row) return null;
      if (Number(row.served)) return row.public_key;
      const replacedAt = new Date(row.key_replaced_at).toISOString();
      const servedUntil = new Date(row.previous_key_valid_until).toISOString();
      throw new AppError(
        'key_replaced',
        `This widget key was replaced on ${replacedAt.slice(0, 10)} and was served until ${servedUntil}: the site needs the widget's new embed code`,
        { replacedAt, servedUntil },
      );
    },

    async withKey(publicKey, use) {
      try {
        return await use(publicKey);
      } catch (e) {
        if (!(e instanceof AppError) || e.code !== 'not_found') throw e;
        const current = await keys.replacement(publicKey);
        if (current === null) throw e;
        return use(current);
      }
    },
  };
  return keys;
}
