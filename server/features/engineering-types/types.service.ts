import type { Sequelize } from 'sequelize';
import { starterCard } from '@shared/domain/starter-card';
import { aircraftTypeDefinitionSchema, type AircraftTypeDefinition } from '@shared/schemas/limits';
import type {
  CreateType,
  LimitsVersionDetail,
  LimitsVersionSummary,
  PublicationProblem,
  TypeDetail,
  TypeSummary,
} from '@shared/schemas/engineering-types';
import { validateTypeDefinition } from '@shared/domain/limits';
import { isDuplicateKey } from '@server/db/unique-violation';
import { updateRow } from '@server/db/rows';
import { staffNames } from '@server/db/staff-names';
import {
  activeAirframeCount,
  insertType,
  insertVersion,
  lockDraft,
  lockLatestVersion,
  typeById,
  typesWithVersions,
  versionById,
  versionSummaries,
  type LimitsVersion,
} from './types.repository';
import { appendAuditEvent } from '@server/audit/audit-trail';
import { contentHash } from '@server/security/hashing';
import { badRequest, conflict, notFound, refusal } from '@server/errors/app-error';
import { phrase, type Phrase, type PhraseValue } from '@shared/i18n/phrase';
import { inTransaction } from '@server/db/retry';

function summary(v: LimitsVersion, names: Map<number, string>): LimitsVersionSummary {
  return {
    id: v.id,
    version: v.version,
    status: v.status,
    publishedAt: v.publishedAt?.toISOString() ?? null,
    publishedBy: v.publishedBy === null ? null : (names.get(v.publishedBy) ?? null),
    createdAt: v.createdAt.toISOString(),
  };
}

export async function listTypes(): Promise<TypeSummary[]> {
  const [types, versions, airframes] = await typesWithVersions();
  const names = await staffNames(versions.map((v) => v.publishedBy));
  return types.map((t) => {
    const own = versions.filter((v) => v.typeId === t.id);
    const current = own.find((v) => v.status === 'published');
    const draft = own.find((v) => v.status === 'draft');
    return {
      id: t.id,
      code: t.code,
      name: t.name,
      current: current ? summary(current, names) : null,
      draft: draft ? summary(draft, names) : null,
      airframes: airframes.filter((a) => a.typeId === t.id).length,
    };
  });
}

export async function typeDetail(typeId: number): Promise<TypeDetail> {
  const type = await typeById(typeId);
  if (!type) throw notFound(refusal('types.typeGone'));
  const versions = await versionSummaries(typeId);
  const names = await staffNames(versions.map((v) => v.publishedBy));
  const current = versions.find((v) => v.status === 'published');
  const draft = versions.find((v) => v.status === 'draft');
  return {
    id: type.id,
    code: type.code,
    name: type.name,
    current: current ? summary(current, names) : null,
    draft: draft ? summary(draft, names) : null,
    airframes: await activeAirframeCount(typeId),
    versions: versions.map((v) => summary(v, names)),
  };
}

export async function versionDetail(typeId: number, versionId: number): Promise<LimitsVersionDetail> {
  const row = await versionById(versionId);
  if (!row || row.typeId !== typeId) throw notFound(refusal('types.versionGone'));
  const names = await staffNames([row.publishedBy]);
  return {
    ...summary(row, names),
    typeId: row.typeId,
    definition: aircraftTypeDefinitionSchema.parse(JSON.parse(row.definition)),
  };
}

export async function createType(sequelize: Sequelize, input: CreateType, actorId: number) {
  const definition = {
    ...(input.definition ?? starterCard(input.code, input.name)),
    code: input.code,
    name: input.name,
  };
  try {
    return await inTransaction(sequelize, async (transaction) => {
      const type = await insertType({ code: input.code, name: input.name }, transaction);
      const draft = await insertVersion(
        {
          typeId: type.id,
          version: 1,
          status: 'draft',
          definition: JSON.stringify(definition),
          publishedAt: null,
          publishedBy: null,
        },
        transaction,
      );
      await appendAuditEvent(sequelize, transaction, {
        actorId,
        action: 'type.created',
        entity: 'aircraft_type',
        entityId: String(type.id),
        payload: { code: type.code, name: type.name, draftVersionId: draft.id },
      });
      return { id: type.id, draftVersionId: draft.id };
    });
  } catch (err) {
    if (isDuplicateKey(err))
      throw conflict('type_code_taken', refusal('types.codeTaken', { code: input.code }));
    throw err;
  }
}

/**
 * Saves the type's draft, making one (the next version number) when there is none. Code and name stay the type's
 * own; the definition is checked for shape only, bands are judged at publication.
 */
export async function saveDraft(
  sequelize: Sequelize,
  typeId: number,
  definition: AircraftTypeDefinition,
  actorId: number,
) {
  const type = await typeById(typeId);
  if (!type) throw notFound(refusal('types.typeGone'));
  const stored = JSON.stringify({ ...definition, code: type.code });
  return inTransaction(sequelize, async (transaction) => {
    const latest = await lockLatestVersion(typeId, transaction);
    let draft: LimitsVersion;
    if (latest && latest.status === 'draft') {
      await updateRow(latest, { definition: stored }, transaction);
      draft = latest;
    } else {
      draft = await insertVersion(
        {
          typeId,
          version: (latest?.version ?? 0) + 1,
          status: 'draft',
          definition: stored,
          publishedAt: null,
          publishedBy: null,
        },
        transaction,
      );
    }
    if (definition.name !== type.name) await updateRow(type, { name: definition.name }, transaction);
    await appendAuditEvent(sequelize, transaction, {
      actorId,
      action: 'limits.draft_saved',
      entity: 'limits_version',
      entityId: String(draft.id),
      payload: { type: type.code, version: draft.version, definitionHash: contentHash(JSON.parse(stored)) },
    });
    return { id: draft.id, version: draft.version, status: draft.status };
  });
}

/** Editing one named version: only a draft can change; a published version is a record checks rest on. */
export async function editVersion(
  sequelize: Sequelize,
  typeId: number,
  versionId: number,
  definition: AircraftTypeDefinition,
  actorId: number,
) {
  const row = await versionById(versionId);
  if (!row || row.typeId !== typeId) throw notFound(refusal('types.versionGone'));
  if (row.status === 'published') {
    throw conflict('limits_version_published', refusal('types.versionPublished', { version: row.version }));
  }
  return saveDraft(sequelize, typeId, definition, actorId);
}

/** Several sentences read one after the other. */
function sentences(parts: Phrase[]): PhraseValue {
  const [first, ...rest] = parts;
  if (first === undefined) return '';
  if (rest.length === 0) return { phrase: first };
  return {
    phrase: phrase('engineeringTypes:problems.sentences', {
      first: { phrase: first },
      rest: sentences(rest),
    }),
  };
}

/** Problems that stop publication: the limits engine's own check plus cards that ask nothing. */
export function publicationProblems(definition: AircraftTypeDefinition): PublicationProblem[] {
  return validateTypeDefinition(definition).map((p) => ({
    checkpoint: p.checkpoint,
    kind: p.kind,
    reason: phrase('engineeringTypes:problems.atCheckpoint', {
      checkpoint: p.checkpoint,
      problem: { phrase: p.reason },
    }),
    ...(p.bands ? { bands: p.bands } : {}),
  }));
}

export async function publishDraft(sequelize: Sequelize, typeId: number, actorId: number, now = new Date()) {
  const type = await typeById(typeId);
  if (!type) throw notFound(refusal('types.typeGone'));
  return inTransaction(sequelize, async (transaction) => {
    const draft = await lockDraft(typeId, transaction);
    if (!draft) throw conflict('no_draft', refusal('types.noDraft', { type: type.code }));
    const parsed = aircraftTypeDefinitionSchema.safeParse(JSON.parse(draft.definition));
    if (!parsed.success) throw badRequest('draft_invalid', refusal('types.draftIncomplete'));
    const problems = publicationProblems(parsed.data);
    if (problems.length > 0) {
      throw badRequest(
        'limits_problems',
        refusal('types.cannotPublish', {
          version: draft.version,
          problems: sentences(problems.map((p) => p.reason)),
        }),
        { problems },
      );
    }
    const publishedAt = new Date(Math.floor(now.getTime()));
    await updateRow(draft, { status: 'published', publishedAt, publishedBy: actorId }, transaction);
    await appendAuditEvent(sequelize, transaction, {
      actorId,
      action: 'limits.published',
      entity: 'limits_version',
      entityId: String(draft.id),
      payload: { type: type.code, version: draft.version, definitionHash: contentHash(parsed.data) },
      at: publishedAt,
    });
    return {
      id: draft.id,
      version: draft.version,
      status: 'published' as const,
      publishedAt: publishedAt.toISOString(),
    };
  });
}
