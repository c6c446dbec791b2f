import { localNumber, systemWords } from '@shared/domain/words';
import { say } from '@shared/i18n/translate';
import { mailWords } from '@server/mail/mail-language';
import type { Sequelize } from 'sequelize';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { formatInstant } from '@shared/domain/when';
import { limitsCaution } from '@shared/schemas/limits';
import { type HandoverConsumption, type HandoverSent, type HandoverSummary } from '@shared/schemas/handover';
import { currentLimits } from '@server/db/limits-store';
import { fluidAdded, type AirframeFluid } from '@server/db/fluid-records';
import { staffNames } from '@server/db/staff-names';
import { loggedFlightHours } from '@server/db/usage-records';
import { appendAuditEvent } from '@server/audit/audit-trail';
import type { Mailer } from '@server/mail/mailer';
import {
  consumptionWindowDays,
  countChecks,
  flightHoursBetween,
  handoverText,
  systemConsumption,
} from './handover-summary';
import { activeAirframes, recordedHours, shiftRecords } from './handover.repository';
import { inTransaction } from '@server/db/retry';
import { phraseWords } from '@shared/i18n/phrase';

const dayMs = 24 * 3_600_000;

const round = (value: number) => Math.round(value * 1000) / 1000;

/** How many decimals a configured figure was written with, so "0.05" stays "0.05" (German "0,05"). */
const countDecimals = (value: number) => String(value).split('.')[1]?.length ?? 0;

function sumBy<T>(items: readonly T[], key: (item: T) => string, amount: (item: T) => number) {
  const totals = new Map<string, { first: T; total: number }>();
  for (const item of items) {
    const entry = totals.get(key(item)) ?? { first: item, total: 0 };
    entry.total += amount(item);
    totals.set(key(item), entry);
  }
  return [...totals.values()];
}

/** Consumption over the last 7 days to `to` for every airframe and system that took fluid in that time. */
export async function consumptionAt(sequelize: Sequelize, to: Date, airframeIds?: number[]) {
  const airframes = await activeAirframes(airframeIds);
  const windowStart = new Date(to.getTime() - consumptionWindowDays * dayMs);
  const fluid = await fluidAdded(
    sequelize,
    airframes.map((a) => a.id),
    windowStart,
    to,
  );
  const withFluid = airframes.filter((a) => fluid.some((f) => f.airframeId === a.id));
  const results: HandoverConsumption[] = [];
  const unknownHours: string[] = [];
  for (const airframe of withFluid) {
    const limits = await currentLimits(airframe.typeId);
    if (!limits) continue;
    // The flight log when it is kept; before it was, the hours stamped on checks are all there is.
    const logged = await loggedFlightHours(airframe.id, windowStart, to);
    const flightHours =
      logged ??
      flightHoursBetween(
        (await recordedHours(airframe.id, to)).map((c) => ({
          at: c.signedAt,
          hours: Number(c.airframeHours),
        })),
        windowStart,
        to,
      );
    if (flightHours === null) unknownHours.push(airframe.fleetNumber);
    const ours = fluid.filter((f) => f.airframeId === airframe.id);
    for (const system of [...new Set(ours.map((f) => f.system ?? 'unknown system'))]) {
      results.push(
        systemConsumption({
          airframe: { id: airframe.id, fleetNumber: airframe.fleetNumber },
          system,
          events: ours.filter((f) => (f.system ?? 'unknown system') === system),
          flightHours,
          windowEnd: to,
          alertLPerFh: limits.definition.consumptionAlertLPerFh,
        }),
      );
    }
  }
  return { results, unknownHours };
}

/** The fleet's states now, from the airframes feature's derivation, so the handover says what the board says. */
export type FleetNow = () => Promise<AirframeSummary[]>;

export async function handoverSummary(
  sequelize: Sequelize,
  from: Date,
  to: Date,
  fleetNow: FleetNow,
): Promise<HandoverSummary> {
  const [airframes, [checks, opened, released, stillOpen], states] = await Promise.all([
    activeAirframes(),
    shiftRecords(from, to),
    fleetNow(),
  ]);
  const fleet = new Map(airframes.map((a) => [a.id, { id: a.id, fleetNumber: a.fleetNumber }]));
  const ref = (id: number) => fleet.get(id) ?? { id, fleetNumber: `#${id}` };
  const releasers = await staffNames(released.map((h) => h.releasedBy));
  const fluid: AirframeFluid[] = await fluidAdded(sequelize, [...fleet.keys()], from, to);
  const system = (f: AirframeFluid) => f.system ?? 'unknown system';
  const { results, unknownHours } = await consumptionAt(sequelize, to);
  const notes: string[] = [];
  if (unknownHours.length > 0) {
    notes.push(
      `Flight hours over the last ${consumptionWindowDays} days are not known for ${unknownHours.join(', ')} ` +
        '(the airframe hours did not change between checks), so no per-flight-hour consumption alert can be given for them.',
    );
  }
  return {
    from: from.toISOString(),
    to: to.toISOString(),
    checks: countChecks(checks),
    holdsOpened: opened.map((h) => ({
      id: h.id,
      airframe: ref(h.airframeId),
      reason: h.reason,
      openedAt: h.openedAt.toISOString(),
      checkId: h.checkId,
    })),
    holdsReleased: released.map((h) => ({
      id: h.id,
      airframe: ref(h.airframeId),
      releasedAt: h.releasedAt!.toISOString(),
      releasedBy: releasers.get(h.releasedBy ?? 0) ?? 'unknown',
    })),
    holdsStillOpen: stillOpen,
    states: states.map((a) => ({
      airframe: { id: a.id, fleetNumber: a.fleetNumber },
      state: a.state,
      causes: a.causes,
    })),
    defects: states
      .filter((a) => a.defects.length > 0)
      .map((a) => ({ airframe: { id: a.id, fleetNumber: a.fleetNumber }, defects: a.defects })),
    fluidUsed: {
      bySystem: sumBy(fluid, system, (f) => f.litres).map((e) => ({
        system: system(e.first),
        litres: round(e.total),
      })),
      byAirframe: sumBy(
        fluid,
        (f) => `${f.airframeId}|${system(f)}`,
        (f) => f.litres,
      ).map((e) => ({
        airframe: ref(e.first.airframeId),
        system: system(e.first),
        litres: round(e.total),
      })),
    },
    consumption: results,
    consumptionAlerts: results.flatMap((r) => (r.alert ? [r.alert.message] : [])),
    notes,
    caution: limitsCaution,
  };
}

export async function sendHandover(
  sequelize: Sequelize,
  mailer: Mailer,
  from: Date,
  to: Date,
  by: Express.User,
  fleetNow: FleetNow,
): Promise<HandoverSent> {
  const summary = await handoverSummary(sequelize, from, to, fleetNow);
  const words = mailWords(mailer.language);
  const at = (when: string) => formatInstant(when, 'UTC', words.language);
  const subject = say(words.t, 'email:handover.subject', {
    from: at(summary.from),
    to: at(summary.to),
    name: by.name,
  });
  const outcome = await mailer.send({ topic: 'handover', subject, text: handoverText(summary, words) });
  await inTransaction(sequelize, (transaction) =>
    appendAuditEvent(sequelize, transaction, {
      actorId: by.id,
      action: 'handover.sent',
      entity: 'handover',
      entityId: String(outcome.deliveryId ?? 0),
      payload: { from: summary.from, to: summary.to, status: outcome.status, recipients: outcome.to },
    }),
  );
  return {
    deliveryId: outcome.deliveryId ?? 0,
    status: outcome.status === 'sent' ? 'sent' : 'failed',
    to: outcome.to,
    subject,
    error: outcome.error,
  };
}

/** E-mails each consumption alert once per airframe, system and day, for airframes that took fluid in the last day. */
export function consumptionMailSweep(sequelize: Sequelize, mailer: Mailer) {
  return async () => {
    const now = new Date();
    const recent = await fluidAdded(
      sequelize,
      (await activeAirframes()).map((a) => a.id),
      new Date(now.getTime() - dayMs),
      now,
    );
    if (recent.length === 0) return;
    const { results } = await consumptionAt(sequelize, now, [...new Set(recent.map((f) => f.airframeId))]);
    const { t } = mailWords(mailer.language);
    for (const r of results) {
      if (!r.alert) continue;
      await mailer.send({
        topic: 'consumption',
        topicKey: `consumption:${r.airframe.id}:${r.system}:${now.toISOString().slice(0, 10)}`,
        subject: say(t, 'email:consumption.subject', {
          fleet: r.airframe.fleetNumber,
          system: systemWords(r.system, [], t),
        }),
        text: [
          phraseWords(r.alert.message, t),
          '',
          say(t, 'email:consumption.added', {
            litres: localNumber(r.litresAdded, 2, t),
            days: r.windowDays,
            hours: localNumber(r.flightHours ?? 0, 1, t),
            alert: localNumber(r.alertLPerFh, countDecimals(r.alertLPerFh), t),
          }),
          '',
          say(t, 'words:limitsCaution'),
        ].join('\n'),
      });
    }
  };
}
