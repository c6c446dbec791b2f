import { Op, type Sequelize } from 'sequelize';
import { runSql } from './sql';
import type { FluidAddedItem } from '@shared/schemas/acceptance';
import { ServicingEntry } from './models';
import { limitsById } from './limits-store';
import { countedOnce } from '@shared/domain/servicing';

export type AirframeFluid = FluidAddedItem & { airframeId: number };

/**
 * Fluid put into the airframes' systems in (from, to]: top-ups recorded at a level checkpoint, and the readings
 * of older cards' "fluid added" checkpoints (code ending in .fluid_added) above zero, each litre once: a reading
 * beside a top-up of the same system in the same check is not counted again (`countedOnce`). Newest first.
 */
export async function fluidAdded(
  sequelize: Sequelize,
  airframeIds: number[],
  from: Date,
  to: Date,
): Promise<AirframeFluid[]> {
  if (airframeIds.length === 0) return [];
  const [entries, readings] = await Promise.all([
    ServicingEntry.findAll({
      where: { airframeId: { [Op.in]: airframeIds }, addedAt: { [Op.gt]: from, [Op.lte]: to } },
    }),
    runSql<
      {
        check_id: string;
        airframe_id: number;
        limits_version_id: number;
        signed_at: Date;
        checkpoint_code: string;
        value: number;
      }[]
    >(
      sequelize,
      `SELECT r.check_id, c.airframe_id, c.limits_version_id, c.signed_at, r.checkpoint_code, r.value
         FROM readings r JOIN checks c ON c.id = r.check_id
        WHERE c.airframe_id IN (?) AND c.signed_at > ? AND c.signed_at <= ?
          AND r.checkpoint_code LIKE '%.fluid_added' AND r.value > 0`,
      [airframeIds, from, to],
    ),
  ]);
  const fromReadings = await Promise.all(
    readings.map(async (r): Promise<AirframeFluid> => {
      const limits = await limitsById(r.limits_version_id);
      const checkpoint = limits?.definition.checkpoints.find((c) => c.code === r.checkpoint_code);
      return {
        airframeId: r.airframe_id,
        at: new Date(r.signed_at).toISOString(),
        checkId: r.check_id,
        code: r.checkpoint_code,
        system: checkpoint?.system ?? r.checkpoint_code.replace(/\.fluid_added$/, ''),
        litres: Number(r.value),
        fluidSpec: null,
        batch: null,
        source: 'reading',
      };
    }),
  );
  const fromEntries = entries.map((e): AirframeFluid => ({
    airframeId: e.airframeId,
    at: e.addedAt.toISOString(),
    checkId: e.checkId,
    code: e.checkpointCode,
    system: e.system,
    litres: e.quantityL,
    fluidSpec: e.fluidSpec,
    batch: e.batch,
    source: 'servicing',
  }));
  return countedOnce([...fromEntries, ...fromReadings]).sort((a, b) => Date.parse(b.at) - Date.parse(a.at));
}

export interface LevelReadingRow {
  airframe_id: number;
  check_id: string;
  signed_at: Date;
  context: string;
  checkpoint_code: string;
  value: number;
  unit: string;
}

/** The readings of the given level checkpoints on the airframes' checks signed in (from, to], oldest first. */
export async function levelReadings(
  sequelize: Sequelize,
  airframeIds: number[],
  codes: string[],
  from: Date,
  to: Date,
): Promise<LevelReadingRow[]> {
  if (airframeIds.length === 0 || codes.length === 0) return [];
  return runSql<LevelReadingRow[]>(
    sequelize,
    `SELECT c.airframe_id, c.id AS check_id, c.signed_at, c.context, r.checkpoint_code, r.value, r.unit
       FROM checks c JOIN readings r ON r.check_id = c.id
      WHERE c.airframe_id IN (?) AND c.signed_at > ? AND c.signed_at <= ?
        AND r.checkpoint_code IN (?) AND r.value IS NOT NULL AND r.unit IS NOT NULL
      ORDER BY c.signed_at`,
    [airframeIds, from, to, codes],
  );
}
