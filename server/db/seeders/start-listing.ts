import { Op } from 'sequelize';
import { Airframe, Staff, Tag } from '../models';

/** Every live airframe tag with its fleet number, for the links `npm start` prints. */
export async function liveTags(): Promise<{ fleetNumber: string | undefined; token: string }[]> {
  const tags = await Tag.findAll({ where: { revokedAt: null }, order: [['airframeId', 'ASC']] });
  const airframes = new Map((await Airframe.findAll()).map((a) => [a.id, a.fleetNumber]));
  return tags.map((t) => ({ fleetNumber: airframes.get(t.airframeId), token: t.token }));
}

/** The first active engineer, who makes the printed board link. */
export async function firstEngineerId(): Promise<number | null> {
  const engineer = await Staff.findOne({
    where: { roles: { [Op.like]: '%engineering%' }, active: true },
    order: [['id', 'ASC']],
  });
  return engineer?.id ?? null;
}
