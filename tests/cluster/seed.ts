import { randomUUID } from 'node:crypto';
import { openDatabase } from '../../server/db/connection';
import { Airframe, Base, Staff } from '../../server/db/models';
import { hashSecret } from '../../server/security/hashing';
import { createEnrolment, redeemEnrolment } from '../../server/features/kiosks/kiosks.service';
import { demoTypes } from '../../shared/demo/demo-types';
import { publishedType } from '../setup/type-rows';

// What the cluster test's tablets need, written through one node: one type with the demo RX-4 limits, an airframe,
// a mechanic and an enrolled kiosk per tablet, and an engineer to verify the trail at the desk.

export interface Fleet {
  limitsId: number;
  tablets: { airframeId: number; badge: string; pin: string; kioskToken: string }[];
  engineer: { badge: string; password: string };
}

const unique = () => randomUUID().replace(/-/g, '').slice(0, 8);

export async function seedFleet(url: string, tablets: number): Promise<Fleet> {
  const sequelize = openDatabase(url, { pool: 2 });
  try {
    const definition = demoTypes[0]!;
    const code = `CL-${unique()}`;
    const [base] = await Base.findOrCreate({
      where: { code: 'CL' },
      defaults: { code: 'CL', name: 'Cluster base' },
    });
    const { type, limits } = await publishedType(definition, code, `${definition.name} (cluster test)`);
    const pin = '2580';
    const pinHash = await hashSecret(pin, 4);
    const list: Fleet['tablets'] = [];
    for (let i = 0; i < tablets; i += 1) {
      const airframe = await Airframe.create({
        fleetNumber: `C-${String(i + 1).padStart(2, '0')}-${unique().slice(0, 4)}`,
        serial: `S-${unique()}`,
        typeId: type.id,
        baseId: base!.id,
        hours: 1000 + i,
      });
      const mechanic = await Staff.create({
        badgeNumber: `M${unique()}`,
        name: `Cluster mechanic ${i + 1}`,
        licenceNumber: `LIC-${unique().slice(0, 6)}`,
        roles: 'mechanic',
        pinHash,
        passwordHash: null,
        lockedUntil: null,
      });
      const enrolment = await createEnrolment(`Cluster tablet ${i + 1}`, null);
      const { token } = await redeemEnrolment(enrolment.code);
      list.push({ airframeId: airframe.id, badge: mechanic.badgeNumber, pin, kioskToken: token });
    }
    const password = `cluster-${unique()}`;
    const engineer = await Staff.create({
      badgeNumber: `E${unique()}`,
      name: 'Cluster engineer',
      licenceNumber: `LIC-${unique().slice(0, 6)}`,
      roles: 'engineering',
      pinHash,
      passwordHash: await hashSecret(password, 4),
      lockedUntil: null,
    });
    return { limitsId: limits.id, tablets: list, engineer: { badge: engineer.badgeNumber, password } };
  } finally {
    await sequelize.close();
  }
}
