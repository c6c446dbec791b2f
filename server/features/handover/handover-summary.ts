import { localNumber, systemWords } from '@shared/domain/words';
import { sourceLanguage } from '@shared/i18n/languages';
import { englishTranslate, say, type Translate } from '@shared/i18n/translate';
import { limitsCaution } from '@shared/schemas/limits';
import type { MailWords } from '@server/mail/mail-language';
import { consumptionOverWindow } from '@shared/domain/consumption';
import { formatInstant } from '@shared/domain/when';
import { airframeStateLabel, causeLabel } from '@shared/schemas/airframes';
import { checkKindLabel, checkKindLabels, verdictLabel } from '@shared/schemas/plain';
import type { CheckKind, Verdict } from '@shared/schemas/limits';
import type { AirframeRef } from '@shared/schemas/refs';
import type { HandoverConsumption, HandoverSummary } from '@shared/schemas/handover';
import { phrase, phraseWords } from '@shared/i18n/phrase';

export const consumptionWindowDays = 7;

/**
 * Hours flown in (from, to] from the airframe hours recorded with each check: the latest recorded value minus the
 * last one at or before the window start (or the first inside it). Unknown (null) when fewer than two values
 * exist or the hours did not move: the app has no flight log, and "not recorded" is not "not flown".
 */
export function flightHoursBetween(
  recorded: readonly { at: Date; hours: number }[],
  from: Date,
  to: Date,
): number | null {
  const sorted = recorded
    .filter((r) => Number.isFinite(r.hours) && r.at.getTime() <= to.getTime())
    .sort((a, b) => a.at.getTime() - b.at.getTime());
  const before = sorted.filter((r) => r.at.getTime() <= from.getTime()).at(-1);
  const inside = sorted.filter((r) => r.at.getTime() > from.getTime());
  const start = before ?? inside[0];
  const end = inside.at(-1);
  if (!start || !end || end === start) return null;
  const flown = end.hours - start.hours;
  return flown > 0 ? flown : null;
}

/** One system's consumption over the window, with the per-hour alert only when flight hours are known. */
export function systemConsumption(input: {
  airframe: AirframeRef;
  system: string;
  events: readonly { at: string; litres: number }[];
  flightHours: number | null;
  windowEnd: Date;
  alertLPerFh: number;
}): HandoverConsumption {
  const summary = consumptionOverWindow({
    system: input.system,
    events: input.events.map((e) => ({ at: e.at, system: input.system, litres: e.litres })),
    flights: input.flightHours === null ? [] : [{ at: input.windowEnd, flightHours: input.flightHours }],
    windowEnd: input.windowEnd,
    windowDays: consumptionWindowDays,
    alertLPerFh: input.alertLPerFh,
  });
  const known = input.flightHours !== null;
  return {
    airframe: input.airframe,
    system: input.system,
    windowDays: consumptionWindowDays,
    litresAdded: summary.litresAdded,
    flightHours: known ? summary.flightHours : null,
    litresPerFlightHour: known ? summary.litresPerFlightHour : null,
    litresPerDay: summary.litresPerDay,
    alertLPerFh: input.alertLPerFh,
    alert:
      known && summary.alert
        ? {
            kind: summary.alert.kind,
            message: phrase('ofAirframe', {
              fleet: input.airframe.fleetNumber,
              what: { phrase: summary.alert.message },
            }),
          }
        : null,
  };
}

export function countChecks(
  checks: readonly { kind: CheckKind; verdict: Verdict }[],
): HandoverSummary['checks'] {
  const kinds = Object.keys(checkKindLabels) as CheckKind[];
  const byKind = kinds
    .map((kind) => {
      const ofKind = checks.filter((c) => c.kind === kind);
      const count = (v: Verdict) => ofKind.filter((c) => c.verdict === v).length;
      return {
        kind,
        total: ofKind.length,
        in_limits: count('in_limits'),
        service: count('service'),
        out_of_limits: count('out_of_limits'),
      };
    })
    .filter((k) => k.total > 0);
  return { total: checks.length, byKind };
}

const litres = (value: number, t: Translate) => `${localNumber(value, 2, t)} L`;

/** The handover as plain text for the e-mail, in the order a lead reads it out, in the recipients' language. */
export function handoverText(
  summary: HandoverSummary,
  { language, t }: MailWords = { language: sourceLanguage, t: englishTranslate() },
): string {
  const at = (when: string) => formatInstant(when, 'UTC', language);
  const w = (key: string, values?: Record<string, unknown>) => say(t, `email:handover.${key}`, values);
  const lines = [
    w('title', { from: at(summary.from), to: at(summary.to) }),
    '',
    w('airframesNow'),
    ...summary.states.map(
      (s) =>
        `- ${s.airframe.fleetNumber}: ${airframeStateLabel(s.state, t)}` +
        (s.causes.length ? ` (${s.causes.map((c) => causeLabel(c, t).toLowerCase()).join(', ')})` : ''),
    ),
    '',
    w('defects'),
    ...(summary.defects.length === 0
      ? [w('none')]
      : summary.defects.flatMap((a) =>
          a.defects.map((d) =>
            w('defectLine', {
              fleet: a.airframe.fleetNumber,
              number: d.number,
              description: d.description,
              reason: phraseWords(d.reason, t),
            }),
          ),
        )),
    '',
    w('checksSigned', { count: summary.checks.total }),
  ];
  const verdict = (v: Verdict) => verdictLabel(v, t);
  for (const k of summary.checks.byKind) {
    lines.push(
      `- ${checkKindLabel(k.kind, t)}: ${k.total} (${verdict('in_limits')} ${k.in_limits}, ${verdict('service')} ${k.service}, ${verdict('out_of_limits')} ${k.out_of_limits})`,
    );
  }
  lines.push('', w('holdsOpened', { count: summary.holdsOpened.length }));
  for (const h of summary.holdsOpened)
    lines.push(
      w('holdOpenedLine', { fleet: h.airframe.fleetNumber, id: h.id, at: at(h.openedAt), reason: h.reason }),
    );
  lines.push(w('holdsReleased', { count: summary.holdsReleased.length }));
  for (const h of summary.holdsReleased)
    lines.push(
      w('holdReleasedLine', {
        fleet: h.airframe.fleetNumber,
        id: h.id,
        at: at(h.releasedAt),
        name: h.releasedBy,
      }),
    );
  lines.push(w('holdsStillOpen', { count: summary.holdsStillOpen }));
  lines.push('', w('fluidUsed'));
  if (summary.fluidUsed.byAirframe.length === 0) lines.push(w('noFluid'));
  for (const f of summary.fluidUsed.byAirframe)
    lines.push(`- ${f.airframe.fleetNumber} ${systemWords(f.system, [], t)}: ${litres(f.litres, t)}`);
  for (const s of summary.fluidUsed.bySystem)
    lines.push(w('systemTotal', { system: systemWords(s.system, [], t), litres: litres(s.litres, t) }));
  lines.push('', w('consumptionAlerts'));
  if (summary.consumptionAlerts.length === 0) lines.push(w('none'));
  for (const a of summary.consumptionAlerts) lines.push(`- ${phraseWords(a, t)}`);
  if (summary.notes.length > 0) lines.push('', w('notes'), ...summary.notes.map((n) => `- ${n}`));
  lines.push('', summary.caution === limitsCaution ? say(t, 'words:limitsCaution') : summary.caution);
  return lines.join('\n');
}
