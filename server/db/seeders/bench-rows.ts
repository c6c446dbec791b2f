import { AircraftType, Airframe, LimitsVersion, Staff } from '../models';

/** Mechanics of the bench's own (badges 9000 and up), all with the same PIN hash. */
export async function benchMechanics(count: number, pinHash: string) {
  const rows = await Staff.bulkCreate(
    Array.from({ length: count }, (_, i) => ({
      badgeNumber: `9${String(i).padStart(3, '0')}`,
      name: `Bench mechanic ${i + 1}`,
      licenceNumber: `BENCH-${i + 1}`,
      roles: 'mechanic',
      pinHash,
      passwordHash: null,
      lockedUntil: null,
    })),
  );
  return rows.map((m) => ({ id: m.id, badge: m.badgeNumber }));
}

/** Each type's id and its (first) limits version's id, by type code. */
export async function typeAndLimitsIds() {
  const [types, limits] = await Promise.all([AircraftType.findAll(), LimitsVersion.findAll()]);
  return {
    typeIds: new Map(types.map((t) => [t.code, t.id])),
    limitsIds: new Map(types.map((t) => [t.code, limits.find((l) => l.typeId === t.id)!.id])),
  };
}

/** Ids of the airframes of one type, or of all. */
export async function airframeIdsOf(typeId?: number) {
  const rows = await Airframe.findAll({ where: typeId ? { typeId } : {}, attributes: ['id'] });
  return rows.map((a) => a.id);
}
