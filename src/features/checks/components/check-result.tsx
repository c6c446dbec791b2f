import type { AirframeSummary } from '@shared/schemas/airframes';
import type { StoredCheck } from '@shared/schemas/checks';
import { isPressureUnit } from '@shared/domain/units';
import { DefectLines, defectsBesideHolds } from '@/components/ui/defect-lines';
import { Notice } from '@/components/ui/notice';
import { StateBadge, stateWords } from '@/components/ui/state-badge';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { calendarDay, localTime } from '@/lib/when';
import { photoUrl } from '../api/upload-photo';
import { useTranslation } from 'react-i18next';
import { useCheckWords } from '../model/check-words';
import { ReasonItems } from '@/components/ui/reason-items';

/**
 * The airframe's state after this record, as the board and the pilot see it (the same derivation on the server),
 * so the mechanic is never told something milder than the board shows.
 */
function StateAfter({ airframe, now }: { airframe: AirframeSummary | undefined; now: number }) {
  const { t } = useTranslation('checks');
  if (!airframe) return <p className="text-[24px] text-ink-muted">{t('result.readingState')}</p>;
  return (
    <section
      aria-label={t('result.stateNow')}
      data-testid="state-after-check"
      data-state={airframe.state}
      className="flex flex-col gap-3 rounded-xl border-2 border-ink-line bg-ink-soft p-4"
    >
      <div className="flex flex-wrap items-center gap-4">
        <span className="text-[26px] font-semibold">
          {t('result.isNow', { fleet: airframe.fleetNumber })}
        </span>
        <StateBadge state={airframe.state} causes={airframe.causes} size="lg" />
      </div>
      {airframe.stateReasons.length > 0 && (
        <ul className="flex flex-col gap-1 text-[22px]" aria-label={t('result.why')}>
          <ReasonItems reasons={airframe.stateReasons} />
        </ul>
      )}
      <DefectLines defects={defectsBesideHolds(airframe)} now={now} />
    </section>
  );
}

/** What to do next, titled with the airframe's state in words: "Unserviceable: service needed". */
function NextStep({ check, airframe }: { check: StoredCheck; airframe: AirframeSummary | undefined }) {
  const { t, i18n } = useTranslation('checks');
  const onHold = check.holdOpened || check.verdict === 'out_of_limits';
  const state = airframe ? stateWords(airframe.state, airframe.causes) : null;
  if (onHold) {
    return (
      <Notice tone="warning" big title={t('result.holdTitle', { state: state ?? t('result.holdState') })}>
        {t('result.holdBody')}
      </Notice>
    );
  }
  if (check.verdict === 'service') {
    return (
      <Notice
        tone="warning"
        big
        title={t('result.serviceTitle', { state: state ?? t('result.serviceState') })}
      >
        {t('result.serviceBody')}
      </Notice>
    );
  }
  if (airframe?.state === 'unserviceable') {
    const fromNote = check.note
      ? airframe.defects.find((d) => d.description === check.note?.trim())
      : undefined;
    return (
      <Notice
        tone="warning"
        big
        title={t('result.unserviceableTitle', {
          fleet: airframe.fleetNumber,
          // English writes a state in lower case mid-sentence; German keeps its nouns' capitals.
          state: state
            ? i18n.resolvedLanguage === 'en'
              ? state.toLowerCase()
              : state
            : t('result.unserviceableState'),
        })}
      >
        {fromNote
          ? t('result.unserviceableNote', { number: fromNote.number })
          : t('result.unserviceableBody')}
      </Notice>
    );
  }
  return (
    <Notice tone="normal" big title={t('result.inLimitsTitle')}>
      {check.note ? t('result.inLimitsNote') : t('result.inLimitsBody')}
    </Notice>
  );
}

/** The signed record as the server stored and judged it: every verdict, the airframe's state, and what happens next. */
export function CheckResult({
  check,
  airframe,
  now = Date.now(),
}: {
  check: StoredCheck;
  airframe?: AirframeSummary | undefined;
  now?: number;
}) {
  const { t, words } = useCheckWords();
  const servicingOf = (code: string) => check.servicing.find((entry) => entry.code === code);
  return (
    <div className="flex flex-col gap-5" data-testid="check-result" data-verdict={check.verdict}>
      <div className="flex flex-wrap items-center gap-5">
        <h2 className="text-[40px] font-bold">
          {t('result.title', { fleet: check.airframe.fleetNumber, kind: words.kind(check.kind) })}
        </h2>
        <VerdictBadge verdict={check.verdict} size="lg" />
      </div>
      <p className="text-[22px] text-ink-muted">
        {t('result.signedBy', {
          name: check.signedBy.name,
          badge: check.signedBy.badgeNumber,
          time: localTime(check.signedAt),
          type: check.limitsVersion.typeCode,
          version: check.limitsVersion.version,
          conditions: words.context(check.context),
        })}
      </p>
      <NextStep check={check} airframe={airframe} />
      <StateAfter airframe={airframe} now={now} />
      <ul className="flex flex-col gap-3" aria-label={t('result.verdicts')}>
        {check.readings.map((reading) => (
          <li
            key={reading.code}
            data-testid={`result-${reading.code}`}
            className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-ink-line bg-ink-soft p-3"
          >
            <div className="min-w-[240px] flex-1">
              <div className="text-[24px] font-semibold">{reading.label}</div>
              <div className="text-[22px]">{reading.message}</div>
              {reading.action !== 'None.' && (
                <div className="text-[22px] text-ink-muted">
                  {t('result.next', { action: reading.action })}
                </div>
              )}
              {reading.expected !== null && reading.unit !== null && isPressureUnit(reading.unit) && (
                <div className="text-[22px] text-ink-muted">
                  {t('result.expected', { value: words.value(reading.expected, reading.unit) })}
                </div>
              )}
            </div>
            <span className="tabular text-[30px] font-bold">
              {words.reading(reading.entry, reading.verdict)}
            </span>
            <VerdictBadge verdict={reading.verdict} />
            {servicingOf(reading.code) && (
              <div
                data-testid={`result-fluid-${reading.code}`}
                className="w-full text-[22px] font-semibold text-signal-text"
              >
                {t('result.fluid', {
                  quantity: words.value(servicingOf(reading.code)!.quantityL, 'L', 2),
                  spec: servicingOf(reading.code)!.fluidSpec,
                  batch: servicingOf(reading.code)!.batch,
                  level: words.entry(servicingOf(reading.code)!.levelBefore),
                })}
                {servicingOf(reading.code)!.tool &&
                  t('result.cart', { tool: servicingOf(reading.code)!.tool!.number })}
              </div>
            )}
            {reading.tool && (
              <div data-testid={`result-tool-${reading.code}`} className="w-full text-[22px] text-ink-muted">
                {t('result.readWith', {
                  number: reading.tool.number,
                  description: reading.tool.description,
                  day: calendarDay(reading.tool.calibrationDue),
                })}
              </div>
            )}
            {reading.photos.length > 0 && (
              <div
                className="flex w-full flex-wrap gap-2"
                aria-label={t('photos.photosOf', { subject: reading.label })}
              >
                {reading.photos.map((photo, index) => (
                  <img
                    key={photo.id}
                    src={photoUrl(photo.id)}
                    alt={t('photos.photoOf', { number: index + 1, subject: reading.label })}
                    className="h-[80px] w-[80px] rounded-md border-2 border-ink-line object-cover"
                  />
                ))}
              </div>
            )}
          </li>
        ))}
      </ul>
      {check.note && (
        <section
          aria-label={t('result.note')}
          className="rounded-xl border-2 border-ink-line bg-ink-soft p-4"
        >
          <h3 className="text-[24px] font-semibold">{t('result.note')}</h3>
          {/* Whatever was typed is shown as text, never as markup. */}
          <p data-testid="result-note" className="whitespace-pre-wrap break-words text-[24px]">
            {check.note}
          </p>
        </section>
      )}
    </div>
  );
}
