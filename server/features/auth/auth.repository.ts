import type { Attributes } from 'sequelize';
import { Base, Staff } from '@server/db/models';
import { selectRow } from '@server/db/sql';

export type StaffRecord = Attributes<Staff>;

/** Every signed-in request asks this, so straight to the connector. */
export const staffById = (id: number) => selectRow(Staff, '`id` = ?', [id]);

export const baseTimeZones = async (): Promise<string[]> =>
  (await Base.findAll({ attributes: ['timeZone'] })).map((b) => b.timeZone);
