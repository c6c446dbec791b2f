import type { Sequelize } from 'sequelize';
import type { AirframeSummary, UnserviceableCause } from '@shared/schemas/airframes';
import {
  releaseStatement,
  type AirframeReleaseView,
  type ReleaseAirframeInput,
} from '@shared/schemas/releases';
import { releaseScope, type AirframeStatus, type AirframeStatusInput } from '@shared/domain/status';
import { signedTerms } from '@server/db/authorisation-records';
import { authorityFor } from '@server/security/authority';
import { parseAuthority } from '@server/db/airworthiness-records';
import { conflict, forbidden, notFound, refusal, type RefusalKey } from '@server/errors/app-error';
import {
  signContent,
  signerOf,
  verifySigner,
  type Signature,
  type SigningContext,
} from '@server/security/signing';
import { checkHashes, createRelease, peopleNamed, releaseSignedAs, releasesOf } from './releases.repository';
import { inTransaction } from '@server/db/retry';
import { signingIdReused, signOnce } from '@server/security/sign-once';
import type { Phrase, PhraseValue } from '@shared/i18n/phrase';

/** The board's own derivation for one airframe, handed in by the app so a release rests on the same records. */
export type ReleaseStatusOf = (
  airframeId: number,
  now: Date,
) => Promise<
  | { summary: AirframeSummary; status: AirframeStatus; input: AirframeStatusInput; latest: { id: string }[] }
  | undefined
>;

export async function airframeReleases(airframeId: number): Promise<AirframeReleaseView[]> {
  const rows = await releasesOf(airframeId);
  const people = await peopleNamed([...new Set(rows.map((r) => r.signedBy))]);
  return rows.map((r) => {
    const authority = parseAuthority(r.authorisation);
    return {
      id: r.id,
      airframeId: r.airframeId,
      statement: r.statement,
      chapters: JSON.parse(r.chapters) as (string | null)[],
      certifiedBy: {
        id: r.signedBy,
        name: people.get(r.signedBy)?.name ?? 'unknown',
        licenceNumber: people.get(r.signedBy)?.licenceNumber ?? null,
      },
      authorisation: authority && authority !== 'legacy' ? signedTerms(authority) : null,
      signedAt: r.signedAt.toISOString(),
      contentHash: r.contentHash,
    };
  });
}

/**
 * A certificate of release to service for the airframe (EASA Part-145 145.A.50, from memory), signed by a
 * person whose authorisation covers the type and the work since the last one, who did not sign a re-check that
 * work rests on, while nothing on the airframe is open.
 */
export async function releaseAirframe(
  sequelize: Sequelize,
  statusOf: ReleaseStatusOf,
  airframeId: number,
  input: ReleaseAirframeInput,
  ctx: SigningContext,
  now = new Date(),
) {
  const before = await statusOf(airframeId, now);
  if (!before) throw notFound(refusal('airframes.airframeGone'), 'airframe_unknown');
  const signature = await verifySigner(input, ctx, 'signRelease', now);
  return signOnce(
    input.requestId,
    async (requestId) => {
      const earlier = await releaseSignedAs(requestId);
      if (!earlier) return null;
      if (earlier.airframeId !== airframeId || earlier.signedBy !== signature.row.id) throw signingIdReused();
      return releaseView(airframeId, earlier.id);
    },
    () => signRelease(sequelize, statusOf, airframeId, input.requestId ?? null, signature),
  );
}

const releaseView = async (airframeId: number, id: number) =>
  (await airframeReleases(airframeId)).find((r) => r.id === id)!;

/** The release itself, once the signer is known and no earlier try of this signing was stored. */
async function signRelease(
  sequelize: Sequelize,
  statusOf: ReleaseStatusOf,
  airframeId: number,
  requestId: string | null,
  signature: Signature,
) {
  const detail = (await statusOf(airframeId, signature.at))!;
  refuseOpenWork(detail);
  const scope = releaseScope(detail.input);
  if (scope.recheckSigners.includes(String(signature.row.id))) {
    throw forbidden(refusal('releases.ownRecheck'), 'own_recheck');
  }
  const authorityJson = await authorityFor(
    signature.row.id,
    { typeCode: detail.summary.type.code, chapters: scope.chapters },
    signature.at,
    refusal('signing.acts.releaseAirframe', { fleetNumber: detail.summary.fleetNumber }),
  );
  const restingOn = await checkHashes(detail.latest.map((c) => c.id));
  const content = releaseContent(detail, scope.chapters, restingOn, authorityJson, signature);
  const { row } = await inTransaction(sequelize, (transaction) =>
    signContent(signature, {
      content,
      store: (sealed) =>
        createRelease(
          {
            airframeId,
            statement: releaseStatement,
            chapters: JSON.stringify(scope.chapters),
            authorisation: authorityJson,
            signedBy: signature.row.id,
            signedAt: signature.at,
            signedWith: signature.which,
            requestId,
            ...sealed,
          },
          transaction,
        ),
      trail: { sequelize, transaction },
      event: (created, sealed) => ({
        action: 'airframe.released',
        entity: 'airframe_release',
        entityId: String(created.id),
        payload: { airframeId, contentHash: sealed.contentHash },
      }),
    }),
  );
  return releaseView(airframeId, row.id);
}

type ReleaseDetail = NonNullable<Awaited<ReturnType<ReleaseStatusOf>>>;

/** A cause as it reads inside a sentence ("on hold"). */
const causeWords: Record<UnserviceableCause, RefusalKey> = {
  service_needed: 'releases.cause.serviceNeeded',
  on_hold: 'releases.cause.onHold',
  open_defect: 'releases.cause.openDefect',
  deferral_expired: 'releases.cause.deferralExpired',
};

/** The causes as one phrase: "on hold, open defect". */
const causeList = (causes: readonly UnserviceableCause[]): Phrase =>
  causes.slice(1).reduce(
    (list, cause) =>
      refusal('releases.cause.list', {
        list: { phrase: list },
        next: { phrase: refusal(causeWords[cause]) },
      }),
    refusal(causeWords[causes[0]!]),
  );

/** Nothing is released while it is unserviceable or a check on it is still open. */
function refuseOpenWork({ summary, status }: ReleaseDetail) {
  if (status.state === 'unserviceable') {
    const reasons: PhraseValue = { phrases: status.reasons, joiner: 'semicolon' };
    throw conflict(
      'airframe_unserviceable',
      status.causes.length > 0
        ? refusal('releases.unserviceable', {
            fleetNumber: summary.fleetNumber,
            causes: { phrase: causeList(status.causes) },
            reasons,
          })
        : refusal('releases.unserviceableNoCause', { fleetNumber: summary.fleetNumber, reasons }),
    );
  }
  if (status.state === 'in_progress') {
    throw conflict(
      'check_in_progress',
      refusal('releases.checkInProgress', { fleetNumber: summary.fleetNumber }),
    );
  }
}

/** Exactly what a certificate of release covers. */
function releaseContent(
  { summary, status }: ReleaseDetail,
  chapters: (string | null)[],
  restingOn: { id: string; kind: string; contentHash: string }[],
  authorityJson: string,
  signature: Signature,
) {
  return {
    airframe: {
      id: summary.id,
      fleetNumber: summary.fleetNumber,
      serial: summary.serial,
      type: summary.type.code,
    },
    hours: summary.hours,
    flights: summary.flights,
    statement: releaseStatement,
    chapters,
    checks: restingOn.map((c) => ({ id: c.id, kind: c.kind, contentHash: c.contentHash })),
    deferredDefects: status.defects.map((d) => ({
      number: d.number,
      description: d.description,
      limit: d.reason,
    })),
    certifiedBy: signerOf(signature.row),
    authorisation: JSON.parse(authorityJson) as unknown,
    signedWith: signature.which,
    signedAt: signature.at.toISOString(),
  };
}
