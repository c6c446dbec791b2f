import { aircraftTypeDefinitionSchema, type AircraftTypeDefinition } from '../../shared/schemas/limits';
import { LimitsVersion } from './models';

export interface LoadedLimits {
  id: number;
  typeId: number;
  version: number;
  publishedAt: Date | null;
  definition: AircraftTypeDefinition;
}

// A published version never changes, so its parsed definition can be kept for the life of the process.
const byId = new Map<number, LoadedLimits>();

function load(row: LimitsVersion): LoadedLimits {
  const cached = byId.get(row.id);
  if (cached) return cached;
  const loaded = {
    id: row.id,
    typeId: row.typeId,
    version: row.version,
    publishedAt: row.publishedAt,
    definition: aircraftTypeDefinitionSchema.parse(JSON.parse(row.definition)),
  };
  if (row.status === 'published') byId.set(row.id, loaded);
  return loaded;
}

export async function currentLimits(typeId: number): Promise<LoadedLimits | null> {
  // Which version is current is asked every time (another instance may have published); its text only once.
  const current = await LimitsVersion.findOne({
    where: { typeId, status: 'published' },
    order: [['version', 'DESC']],
    attributes: ['id'],
    raw: true,
  });
  return current ? limitsById(current.id) : null;
}

export async function limitsById(id: number): Promise<LoadedLimits | null> {
  const cached = byId.get(id);
  if (cached) return cached;
  const row = await LimitsVersion.findByPk(id);
  return row ? load(row) : null;
}
