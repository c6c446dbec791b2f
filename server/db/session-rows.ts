import type { Attributes, Sequelize } from 'sequelize';
import { joinedModel, runSql } from './sql';
import { KioskDevice, Staff } from './models';
import { retryTransient } from './retry';

// The `sessions` rows the session store reads and writes on every request, straight through the connector: a
// session whose time has run out is left out even before the package's cleanup removes it.

// Made at the first read: the models have their attributes only once the app has opened the database.
let joined: {
  staff: ReturnType<typeof joinedModel<Staff>>;
  device: ReturnType<typeof joinedModel<KioskDevice>>;
};
const joinedColumns = () =>
  (joined ??= { staff: joinedModel(Staff, 'staff'), device: joinedModel(KioskDevice, 'device') });

export interface SessionRead {
  data: string;
  /** The row of the person the session is signed in as (`passport.user`), when it names one. */
  staff: Attributes<Staff> | null;
  /** The row of the tablet the session was opened on (`kioskId`), when it names one. */
  device: Attributes<KioskDevice> | null;
}

/**
 * A session, with the person it is signed in as and the tablet it was opened on, in one round trip: every request
 * of a signed-in tablet needs all three, and three reads cost three round trips of the busiest path. The rows are
 * read as they stand now; what may be done with them (an active badge, an unrevoked tablet whose cookie matches)
 * is decided where they are used, exactly as for rows read on their own.
 */
export async function readSessionData(
  sequelize: Sequelize,
  sid: string,
  now: Date,
): Promise<SessionRead | null> {
  const { staff, device } = joinedColumns();
  const [row] = await runSql<Record<string, unknown>[]>(
    sequelize,
    `SELECT s.\`data\`, ${staff.list}, ${device.list}
       FROM \`sessions\` s
       LEFT JOIN \`staff\` staff ON staff.\`id\` = CAST(JSON_VALUE(s.\`data\`, '$.passport.user') AS SIGNED)
       LEFT JOIN \`kiosk_devices\` device ON device.\`id\` = CAST(JSON_VALUE(s.\`data\`, '$.kioskId') AS SIGNED)
      WHERE s.\`sid\` = ? AND (s.\`expires\` IS NULL OR s.\`expires\` > ?)`,
    [sid, now],
  );
  if (!row || typeof row.data !== 'string') return null;
  return { data: row.data, staff: staff.rowOf(row), device: device.rowOf(row) };
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
