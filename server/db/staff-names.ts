import { Op } from 'sequelize';
import { Staff } from './models';

/** Names of the people with these ids (nulls and repeats ignored), for lists that say who did what. */
export async function staffNames(ids: (number | null)[]): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((id): id is number => id !== null))];
  if (wanted.length === 0) return new Map();
  const rows = await Staff.findAll({ where: { id: { [Op.in]: wanted } }, attributes: ['id', 'name'] });
  return new Map(rows.map((s) => [s.id, s.name]));
}
