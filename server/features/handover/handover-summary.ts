import { systemWords } from '@shared/domain/words';
import { consumptionOverWindow } from '@shared/domain/consumption';
import { formatInstant } from '@shared/domain/when';
import { airframeStateLabels, causeLabels } from '@shared/schemas/airframes';
import { checkKindLabels, verdictLabels } from '@shared/schemas/plain';
import type { CheckKind, Verdict } from '@shared/schemas/limits';
import type { AirframeRef } from '@shared/schemas/refs';
import type { HandoverConsumption, HandoverSummary } from '@shared/schemas/handover';

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
        ? { kind: summary.alert.kind, message: `${input.airframe.fleetNumber} ${summary.alert.message}` }
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

const litres = (value: number) => `${value.toFixed(2)} L`;

/** The handover as plain text for the e-mail, in the order a lead reads it out. */
export function handoverText(summary: HandoverSummary): string {
  const lines = [
    `Shift handover ${formatInstant(summary.from)} to ${formatInstant(summary.to)}`,
    '',
    'Airframes now:',
    ...summary.states.map(
      (s) =>
        `- ${s.airframe.fleetNumber}: ${airframeStateLabels[s.state]}` +
        (s.causes.length ? ` (${s.causes.map((c) => causeLabels[c].toLowerCase()).join(', ')})` : ''),
    ),
    '',
    'Defects open or deferred:',
    ...(summary.defects.length === 0
      ? ['- none']
      : summary.defects.flatMap((a) =>
          a.defects.map(
            (d) => `- ${a.airframe.fleetNumber} defect ${d.number}: ${d.description} (${d.reason})`,
          ),
        )),
    '',
    `Checks signed: ${summary.checks.total}`,
  ];
  for (const k of summary.checks.byKind) {
    lines.push(
      `- ${checkKindLabels[k.kind]}: ${k.total} (${verdictLabels.in_limits} ${k.in_limits}, ${verdictLabels.service} ${k.service}, ${verdictLabels.out_of_limits} ${k.out_of_limits})`,
    );
  }
  lines.push('', `Holds opened: ${summary.holdsOpened.length}`);
  for (const h of summary.holdsOpened)
    lines.push(`- ${h.airframe.fleetNumber} (hold ${h.id}, ${formatInstant(h.openedAt)}): ${h.reason}`);
  lines.push(`Holds released: ${summary.holdsReleased.length}`);
  for (const h of summary.holdsReleased)
    lines.push(
      `- ${h.airframe.fleetNumber} (hold ${h.id}) released ${formatInstant(h.releasedAt)} by ${h.releasedBy}`,
    );
  lines.push(`Holds still open now: ${summary.holdsStillOpen}`);
  lines.push('', 'Fluid used:');
  if (summary.fluidUsed.byAirframe.length === 0) lines.push('- none recorded');
  for (const f of summary.fluidUsed.byAirframe)
    lines.push(`- ${f.airframe.fleetNumber} ${systemWords(f.system)}: ${litres(f.litres)}`);
  for (const s of summary.fluidUsed.bySystem)
    lines.push(`  total ${systemWords(s.system)}: ${litres(s.litres)}`);
  lines.push('', 'Consumption alerts:');
  if (summary.consumptionAlerts.length === 0) lines.push('- none');
  for (const a of summary.consumptionAlerts) lines.push(`- ${a}`);
  if (summary.notes.length > 0) lines.push('', 'Notes:', ...summary.notes.map((n) => `- ${n}`));
  lines.push('', summary.caution);
  return lines.join('\n');
}
