import type { StoredCheck, ReadingAgainstLimits } from '@shared/schemas/checks';
import { limitsCaution } from '@shared/schemas/limits';
import { checkKindLabels } from '@shared/schemas/plain';
import { readingsAgainstLimits } from '@server/db/reading-limits';
import type { Mailer } from '@server/mail/mailer';
import type { LoadCheck } from './holds.service';
import { defectOfHold, deliveredTopics, holdsOpenedSince } from './holds.repository';
import { formatInstant } from '@shared/domain/when';
import { describeReading } from '@shared/domain/words';

const holdKey = (id: number) => `hold:${id}`;

function readingLine(r: ReadingAgainstLimits): string {
  const limit = r.limitText ? ` (limit: ${r.limitText})` : '';
  return `- ${r.label}: ${describeReading(r.entry, r.verdict)}${limit}. ${r.message} Action: ${r.action}`;
}

/** The hold e-mail: airframe, check, each finding with value, unit and its limit band, so control can act on it alone. */
export function holdMessage(
  hold: { id: number; reason: string; openedAt: Date },
  check: StoredCheck,
  readings: ReadingAgainstLimits[],
  defectNumber: number | null = null,
) {
  const findings = readings.filter((r) => r.verdict === 'out_of_limits');
  const fleet = check.airframe.fleetNumber;
  const subject = `HOLD ${fleet}: ${findings.map((r) => r.label).join(', ') || 'out of limits'}`;
  const text = [
    `Airframe ${fleet} (${check.limitsVersion.typeCode}) is ON HOLD since ${formatInstant(hold.openedAt)}: unserviceable until its release.`,
    '',
    `${checkKindLabels[check.kind]} check signed ${formatInstant(check.signedAt)} by ${check.signedBy.name}` +
      (check.signedBy.licenceNumber ? ` (licence ${check.signedBy.licenceNumber})` : '') +
      `, limits ${check.limitsVersion.typeCode} version ${check.limitsVersion.version}.`,
    '',
    'Out of limits:',
    ...findings.map(readingLine),
    ...(check.note ? ['', `Mechanic's note: ${check.note}`] : []),
    '',
    `Hold ${hold.id}${defectNumber ? `, tech-log defect ${defectNumber}` : ''}: the corrective action is recorded, a passing`,
    're-check is signed, and certifying staff authorised for the type and the work, who signed neither the check,',
    'the re-check nor the corrective action, countersign the release: the certificate of release to service.',
    '',
    limitsCaution,
  ].join('\n');
  return { subject, text };
}

/** Announces holds opened in the last day that have not been announced; runs after commits, never inside one. */
export function holdMailSweep(mailer: Mailer, loadCheck: LoadCheck) {
  return async () => {
    const since = new Date(Date.now() - 24 * 3_600_000);
    const holds = await holdsOpenedSince(since);
    if (holds.length === 0) return;
    const announced = await deliveredTopics(holds.map((h) => holdKey(h.id)));
    for (const hold of holds.filter((h) => !announced.has(holdKey(h.id)))) {
      const check = await loadCheck(hold.checkId);
      const { defect } = await defectOfHold(hold.id);
      const message = holdMessage(hold, check, await readingsAgainstLimits(check), defect?.id ?? null);
      await mailer.send({ topic: 'hold', topicKey: holdKey(hold.id), ...message });
    }
  };
}
