import type { Sequelize } from 'sequelize';
import { unexplainedLevelDrops, type LevelCheck } from '@shared/domain/consumption';
import { convert } from '@shared/domain/units';
import type { AircraftTypeDefinition } from '@shared/schemas/limits';
import type { FluidAlert } from '@shared/schemas/airframes';
import { fluidAdded, levelReadings, type LevelReadingRow } from '@server/db/fluid-records';
import { fleetFlightHours } from '@server/db/usage-records';
import { phrase } from '@shared/i18n/phrase';

/** How far back the board looks for a level that fell between two checks. */
export const levelDropWindowDays = 7;

interface FleetTypes {
  airframes: readonly { id: number; typeId: number }[];
  definitionOf: (typeId: number) => AircraftTypeDefinition | undefined;
}

const levelCodesOf = (definition: AircraftTypeDefinition, system: string) =>
  new Set([
    ...definition.checkpoints.filter((c) => c.system === system && c.kind === 'level').map((c) => c.code),
    ...definition.systems.filter((s) => s.code === system).map((s) => s.reservoirCheckpoint),
  ]);

function levelChecks(rows: readonly LevelReadingRow[], codes: Set<string>, system: string): LevelCheck[] {
  return rows
    .filter((r) => codes.has(r.checkpoint_code))
    .map((r) => {
      const attitude = (JSON.parse(r.context) as { attitude?: LevelCheck['attitude'] }).attitude;
      return {
        at: new Date(r.signed_at),
        system,
        levelL: convert(Number(r.value), r.unit, 'L'),
        ...(attitude ? { attitude } : {}),
      };
    });
}

/**
 * For each airframe, each system whose newest level reading fell below the one before with no flight recorded in
 * between and no fluid drawn to account for it (the trends page's unexplained level drop), in words for the board
 * and the kiosk. An alert, not a finding: it does not change the airframe's state.
 */
export async function levelDropAlerts(
  sequelize: Sequelize,
  fleet: FleetTypes,
  now: Date,
): Promise<Map<number, FluidAlert[]>> {
  const ids = fleet.airframes.map((a) => a.id);
  const from = new Date(now.getTime() - levelDropWindowDays * 86_400_000);
  const allCodes = new Set<string>();
  for (const a of fleet.airframes) {
    const definition = fleet.definitionOf(a.typeId);
    for (const s of definition?.systems ?? [])
      for (const c of levelCodesOf(definition!, s.code)) allCodes.add(c);
  }
  const [readings, fluid, hours] = await Promise.all([
    levelReadings(sequelize, ids, [...allCodes], from, now),
    fluidAdded(sequelize, ids, from, now),
    fleetFlightHours(ids, from, now),
  ]);
  const alerts = new Map<number, FluidAlert[]>();
  for (const a of fleet.airframes) {
    const definition = fleet.definitionOf(a.typeId);
    if (!definition) continue;
    const ours = readings.filter((r) => r.airframe_id === a.id);
    const found = definition.systems.flatMap((s): FluidAlert[] => {
      const checks = levelChecks(ours, levelCodesOf(definition, s.code), s.code);
      const newest = checks.at(-1);
      const drop = unexplainedLevelDrops({
        system: s.code,
        checks,
        events: fluid
          .filter((f) => f.airframeId === a.id && f.system === s.code)
          .map((f) => ({ at: f.at, system: s.code, litres: f.litres })),
        flights: hours.get(a.id) ?? [],
      }).find((d) => d.to === newest);
      if (!drop) return [];
      return [
        {
          system: s.label,
          message: phrase('levelFellUnexplained', {
            system: s.label,
            litres: { decimal: drop.dropL, places: 2 },
          }),
        },
      ];
    });
    if (found.length > 0) alerts.set(a.id, found);
  }
  return alerts;
}
