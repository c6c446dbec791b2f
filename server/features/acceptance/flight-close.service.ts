import type { Sequelize } from 'sequelize';
import type { CloseFlightInput, UsageEntry } from '@shared/schemas/usage';
import { usageFlown, usageProblem, type UsageStepLimits } from '@shared/domain/usage';
import { lastUsage, storeUsage } from '@server/db/usage-records';
import type { LockoutPolicy } from '@server/security/credentials';
import { signContent, signerOf, verifySigner } from '@server/security/signing';
import { badRequest, notFound, refusal } from '@server/errors/app-error';
import { activeAirframe } from './acceptance.repository';
import { inTransaction } from '@server/db/retry';

export interface FlightCloseContext {
  pilot: Express.User;
  lockout: LockoutPolicy;
  usageLimits: UsageStepLimits;
  now?: Date;
}

/**
 * The pilot closes a flight by recording the airframe's hours, flights and landings after it, signed with badge and
 * PIN like an acceptance. The airframe's row is locked while the figures are judged, so two closes of the same
 * flight cannot both add to it; a figure that goes back or jumps too far is refused and nothing is kept.
 */
export async function closeFlight(
  sequelize: Sequelize,
  airframeId: number,
  input: CloseFlightInput,
  ctx: FlightCloseContext,
): Promise<UsageEntry> {
  const signature = await verifySigner(
    { pin: input.pin },
    { signer: ctx.pilot, channel: 'kiosk', lockout: ctx.lockout },
    'closeFlight',
    ctx.now,
  );
  return inTransaction(sequelize, async (transaction) => {
    const airframe = await activeAirframe(airframeId, transaction);
    const last = airframe && (await lastUsage(airframeId, transaction));
    if (!airframe || !last) throw notFound(refusal('airframes.airframeGone'));
    const problem = usageProblem(last, input.usage, ctx.usageLimits);
    if (problem) {
      const words = problem.reason;
      throw badRequest(problem.kind === 'backwards' ? 'usage_backwards' : 'usage_jump', words, {
        path: `usage.${problem.field}`,
        last: { hours: last.hours, flights: last.flights, landings: last.landings },
      });
    }
    const before = { hours: last.hours, flights: last.flights, landings: last.landings };
    const flown = usageFlown(before, input.usage);
    const { row } = await signContent(signature, {
      content: {
        airframe: { id: airframe.id, fleetNumber: airframe.fleetNumber },
        figures: input.usage,
        flown,
        pilot: signerOf(signature.row),
        closedAt: signature.at.toISOString(),
      },
      store: (sealed) =>
        storeUsage(
          {
            airframeId,
            source: 'flight_close',
            checkId: null,
            ...input.usage,
            hoursFlown: flown.hours,
            flightsFlown: flown.flights,
            landingsMade: flown.landings,
            recordedBy: signature.row.id,
            recordedAt: signature.at,
            signedWith: signature.which,
            ...sealed,
          },
          before,
          transaction,
        ),
      trail: { sequelize, transaction },
      event: (stored, sealed) => ({
        action: 'usage.recorded',
        entity: 'airframe_usage',
        entityId: String(stored.id),
        payload: {
          airframe: airframe.fleetNumber,
          source: 'flight_close',
          figures: input.usage,
          flown,
          contentHash: sealed.contentHash,
        },
      }),
    });
    return {
      id: row.id,
      airframeId,
      recordedAt: signature.at.toISOString(),
      recordedBy: { id: signature.row.id, name: signature.row.name },
      source: 'flight_close',
      checkId: null,
      figures: input.usage,
      flown,
    };
  });
}
