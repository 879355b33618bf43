import { QueryTypes, type Sequelize } from 'sequelize';
import type { Migration } from '../migrator.js';

/*
 * Runs no longer store the working of the server's calculation (each step's formula, values and
 * source), its assumptions, cautions or a second copy of the inputs in `server_result`: where they
 * are shown they are made again from the run's inputs with its release's engine (runs/working.ts).
 * This strips them from the rows stored before, a bounded batch at a time (one short transaction
 * each, in the order of the unique run id), so a large table is never locked or logged in one go.
 *
 * Irreversible by design, and the down step says so rather than pretending: what is removed is
 * derived data that the engines make again, but code from before this migration shows only what a
 * row holds, so it would show stripped rows without their working. Rolling back needs that code to
 * regenerate it too; the down step leaves the rows as they are.
 */
const BATCH = 2000;

/** Strip the working from every run that holds it, `batch` rows at a time; returns the rows changed. */
export async function stripWorking(db: Sequelize, batch = BATCH): Promise<number> {
  let after = '';
  let changed = 0;
  for (;;) {
    const ids = await db.query<{ id: string }>('SELECT id FROM runs WHERE id > ? ORDER BY id LIMIT ?', {
      replacements: [after, batch],
      type: QueryTypes.SELECT,
    });
    if (!ids.length) return changed;
    after = ids[ids.length - 1]!.id;
    const [, affected] = await db.query(
      `UPDATE runs
          SET server_result = JSON_REMOVE(server_result, '$.working', '$.assumptions', '$.cautions', '$.inputs')
        WHERE id IN (?) AND JSON_CONTAINS_PATH(server_result, 'one', '$.working')`,
      { replacements: [ids.map((r) => r.id)], type: QueryTypes.UPDATE },
    );
    changed += Number(affected);
  }
}

export const up: Migration = async ({ context: qi }) => {
  await stripWorking(qi.sequelize);
};

export const down: Migration = async () => {
  // Nothing to put back: the working is derived data (see above).
};
