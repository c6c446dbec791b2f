import type { Sequelize } from 'sequelize';
import { runSql } from './sql';
import { retryTransient } from './retry';

/**
 * The `sessions` rows the session store reads and writes on every request, straight through the connector: a
 * session whose time has run out is left out even before the package's cleanup removes it.
 */
export async function readSessionData(sequelize: Sequelize, sid: string, now: Date): Promise<string | null> {
  const [row] = await runSql<{ data: string | null }[]>(
    sequelize,
    'SELECT `data` FROM `sessions` WHERE `sid` = ? AND (`expires` IS NULL OR `expires` > ?)',
    [sid, now],
  );
  return row?.data ?? null;
}

/** One upsert: refused whole on a conflict with another node's write of the same session, so it is sent again. */
export async function writeSessionData(sequelize: Sequelize, sid: string, expires: Date, data: string) {
  await retryTransient(() =>
    runSql(
      sequelize,
      'INSERT INTO `sessions` (`sid`, `expires`, `data`) VALUES (?, ?, ?) ' +
        'ON DUPLICATE KEY UPDATE `expires` = VALUES(`expires`), `data` = VALUES(`data`)',
      [sid, expires, data],
    ),
  );
}
