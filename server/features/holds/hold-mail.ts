import type { StoredCheck, ReadingAgainstLimits } from '@shared/schemas/checks';
import { sourceLanguage } from '@shared/i18n/languages';
import { say, type Translate } from '@shared/i18n/translate';
import { checkKindLabel } from '@shared/schemas/plain';
import { mailWords, type MailWords } from '@server/mail/mail-language';
import { readingsAgainstLimits } from '@server/db/reading-limits';
import type { Mailer } from '@server/mail/mailer';
import type { LoadCheck } from './holds.service';
import { defectOfHold, deliveredTopics, holdsOpenedSince } from './holds.repository';
import { formatInstant } from '@shared/domain/when';
import { describeReading } from '@shared/domain/words';

const holdKey = (id: number) => `hold:${id}`;

// The checkpoint's label, its band's message and action are the type's own data, written by engineering: they
// read as engineering wrote them. Everything else reads in the recipients' language.
function readingLine(r: ReadingAgainstLimits, t: Translate): string {
  const limit = r.limitText ? say(t, 'email:hold.limit', { limit: r.limitText }) : '';
  const action = say(t, 'email:hold.action', { action: r.action });
  return `- ${r.label}: ${describeReading(r.entry, r.verdict, t)}${limit}. ${r.message} ${action}`;
}

/** The hold e-mail: airframe, check, each finding with value, unit and its limit band, so control can act on it alone. */
export function holdMessage(
  hold: { id: number; reason: string; openedAt: Date },
  check: StoredCheck,
  readings: ReadingAgainstLimits[],
  defectNumber: number | null = null,
  { language, t }: MailWords = mailWords(sourceLanguage),
) {
  const findings = readings.filter((r) => r.verdict === 'out_of_limits');
  const fleet = check.airframe.fleetNumber;
  const at = (when: Date | string) => formatInstant(when, 'UTC', language);
  const subject = say(t, 'email:hold.subject', {
    fleet,
    findings: findings.map((r) => r.label).join(', ') || say(t, 'email:hold.subjectNoFindings'),
  });
  const { typeCode, version } = check.limitsVersion;
  const licence = check.signedBy.licenceNumber;
  const text = [
    say(t, 'email:hold.onHold', { fleet, type: typeCode, since: at(hold.openedAt) }),
    '',
    say(t, 'email:hold.signed', {
      kind: checkKindLabel(check.kind, t),
      at: at(check.signedAt),
      name: check.signedBy.name,
    }) +
      (licence ? say(t, 'email:hold.licence', { licence }) : '') +
      say(t, 'email:hold.limits', { type: typeCode, version }),
    '',
    say(t, 'email:hold.outOfLimits'),
    ...findings.map((r) => readingLine(r, t)),
    ...(check.note ? ['', say(t, 'email:hold.note', { note: check.note })] : []),
    '',
    say(t, 'email:hold.holdNumber', { id: hold.id }) +
      (defectNumber ? say(t, 'email:hold.defectNumber', { number: defectNumber }) : '') +
      say(t, 'email:hold.releaseRule'),
    '',
    say(t, 'words:limitsCaution'),
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
      const words = mailWords(mailer.language);
      const readings = await readingsAgainstLimits(check, words.t);
      const message = holdMessage(hold, check, readings, defect?.id ?? null, words);
      await mailer.send({ topic: 'hold', topicKey: holdKey(hold.id), ...message });
    }
  };
}
