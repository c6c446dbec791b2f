import { signedRows } from './audit.repository';
import { canonicalJson, sha256 } from '../security/hashing';

// Tech-log records and other signatures that the audit trail's "verify" proves unchanged: each stored row must
// still hash to its signature, its hash must be the one the trail recorded, and its columns must still say what
// the signed content says.

interface Signed {
  contentHash: string;
  signedContent: string;
}

type Payload = Record<string, unknown>;

function signatureProblem(what: string, row: Signed | null, payload: Payload): string | null {
  if (!row) return `${what} was removed`;
  if (sha256(row.signedContent) !== row.contentHash)
    return `${what}: the signed content does not match its signature hash`;
  if (payload.contentHash !== undefined && payload.contentHash !== row.contentHash)
    return `${what}: its signature hash was replaced`;
  return null;
}

/** The first column whose stored value differs from the signed content, as "what: field was changed". */
function columnsProblem(what: string, stored: Payload, signed: Payload): string | null {
  for (const [field, value] of Object.entries(stored)) {
    if (canonicalJson(value) !== canonicalJson(signed[field]))
      return `${what}: its ${field} was changed after signing`;
  }
  return null;
}

const numberOrNull = (v: unknown) => (v === null || v === undefined ? null : Number(v));

/** The stored row against its signature, then `compare` on its columns against the signed content. */
function storedAsSigned<Row extends Signed>(
  what: string,
  row: Row | null,
  payload: Payload,
  compare: (row: Row, signed: Payload) => string | null,
): string | null {
  const problem = signatureProblem(what, row, payload);
  if (problem || !row) return problem;
  return compare(row, JSON.parse(row.signedContent) as Payload);
}

const parsedOrNull = (json: string | null) => (json ? (JSON.parse(json) as unknown) : null);

async function defectProblem(id: string, payload: Payload) {
  const what = `defect ${id}`;
  return storedAsSigned(what, await signedRows.defect(id), payload, (row, signed) =>
    columnsProblem(
      what,
      {
        description: row.description,
        chapter: row.chapter,
        source: row.source,
        checkId: row.checkId,
        needsIndependentInspection: Boolean(row.needsIndependentInspection),
      },
      signed,
    ),
  );
}

async function entryProblem(id: string, payload: Payload) {
  const what = `tech-log entry ${id}`;
  return storedAsSigned(what, await signedRows.defectEntry(id), payload, (row, signed) => {
    if ((signed.defect as Payload).id !== row.defectId) return `${what}: it was moved to another defect`;
    const stored = {
      kind: row.kind,
      text: row.text,
      independentInspection: Boolean(row.independentInspection),
      category: row.category,
      reference: row.reference,
      authorisation: parsedOrNull(row.authorisation),
    };
    const limit = {
      at: row.limitAt?.toISOString() ?? null,
      hours: numberOrNull(row.limitHours),
      flights: numberOrNull(row.limitFlights),
    };
    return columnsProblem(what, stored, signed) ?? columnsProblem(what, limit, signed.limit as Payload);
  });
}

async function releaseProblem(id: string, payload: Payload) {
  const what = `certificate of release ${id}`;
  return storedAsSigned(what, await signedRows.release(id), payload, (row, signed) => {
    if ((signed.airframe as Payload).id !== row.airframeId)
      return `${what}: it was moved to another airframe`;
    return columnsProblem(
      what,
      {
        statement: row.statement,
        chapters: JSON.parse(row.chapters) as unknown,
        authorisation: JSON.parse(row.authorisation) as unknown,
      },
      signed,
    );
  });
}

async function countersignProblem(payload: Payload) {
  const id = payload.countersignId;
  const what = `hold countersign ${String(id)}`;
  const row = typeof id === 'number' ? await signedRows.countersign(id) : null;
  return storedAsSigned(what, row, payload, (found, signed) =>
    columnsProblem(
      what,
      {
        decision: found.decision,
        reason: found.reason,
        ...(found.legacy ? {} : { authorisation: parsedOrNull(found.authorisation) }),
      },
      signed,
    ),
  );
}

async function acceptanceProblem(id: string, payload: Payload) {
  const row = await signedRows.acceptance(id);
  return signatureProblem(`acceptance ${id}`, row, payload);
}

async function authorisationProblem(id: string, payload: Payload) {
  const row = await signedRows.authorisation(id);
  const what = `authorisation ${id}`;
  if (!row) return `${what} was removed`;
  return columnsProblem(
    what,
    {
      staffId: row.staffId,
      category: row.category,
      typeCodes: JSON.parse(row.typeCodes) as unknown,
      scope: JSON.parse(row.scope) as unknown,
      expiresOn: row.expiresOn,
      reference: row.reference,
    },
    payload,
  );
}

async function draftCloseProblem(id: string, payload: Payload) {
  const row = await signedRows.draft(id);
  // A draft is removed when its check is signed; a closed one that was signed later is gone on purpose.
  if (!row) return (await signedRows.check(id)) ? null : `closed check ${id} was removed`;
  return columnsProblem(`closed check ${id}`, { reason: row.closeReason }, payload);
}

/** Why the record behind this audit event no longer is what was signed or granted, or null when it is. */
export async function signedRecordProblem(event: {
  action: string;
  entityId: string;
  payload: string;
}): Promise<string | null> {
  const payload = JSON.parse(event.payload) as Payload;
  switch (event.action) {
    case 'defect.raised':
    case 'defect.recorded':
      return defectProblem(event.entityId, payload);
    case 'defect.work':
    case 'defect.inspection':
    case 'defect.certification':
    case 'defect.deferral':
      return entryProblem(event.entityId, payload);
    case 'airframe.released':
      return releaseProblem(event.entityId, payload);
    case 'hold.released':
    case 'hold.kept':
      return countersignProblem(payload);
    case 'airframe.accepted':
      return acceptanceProblem(event.entityId, payload);
    case 'authorisation.granted':
      return authorisationProblem(event.entityId, payload);
    case 'check_draft.closed':
      return draftCloseProblem(event.entityId, payload);
    default:
      return null;
  }
}
