import { AircraftType, LimitsVersion } from '../../server/db/models';
import type { AircraftTypeDefinition } from '../../shared/schemas/limits';

/** A type with one published limits version, written straight to the database (API tests and the cluster test). */
export async function publishedType(definition: AircraftTypeDefinition, code: string, name: string) {
  const type = await AircraftType.create({ code, name });
  const limits = await LimitsVersion.create({
    typeId: type.id,
    version: 1,
    status: 'published',
    definition: JSON.stringify({ ...definition, code }),
    publishedAt: new Date(),
    publishedBy: null,
  });
  return { type, limits };
}
