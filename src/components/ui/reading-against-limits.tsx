import { useTranslation } from 'react-i18next';
import type { ReadingAgainstLimits } from '@shared/schemas/checks';
import { valueWords } from '@shared/domain/words';
import { VerdictBadge } from './verdict-badge';
import { describeReading } from '@/lib/describe-entry';

const edgeOf: Record<ReadingAgainstLimits['verdict'], string> = {
  in_limits: 'border-l-normal-edge',
  service: 'border-l-caution-edge',
  out_of_limits: 'border-l-warning-edge',
};

/**
 * One stored reading next to the limit band it was judged against, as the lead and the pilot read it: the value
 * as entered, the verdict in word + shape + colour, the band in words, what it means and where the limit comes from.
 */
export function ReadingAgainstLimitsRow({ reading }: { reading: ReadingAgainstLimits }) {
  const { t } = useTranslation('common');
  const marks = reading.marks;
  const unit = reading.canonicalUnit;
  return (
    <li
      data-testid={`reading-${reading.code}`}
      data-verdict={reading.verdict}
      className={`flex flex-col gap-2 rounded-xl border-2 border-l-[10px] border-ink-line bg-ink-soft p-4 ${edgeOf[reading.verdict]}`}
    >
      <div className="flex flex-wrap items-center gap-x-5 gap-y-2">
        <span className="min-w-[220px] flex-1 text-[26px] font-semibold leading-tight">{reading.label}</span>
        <span className="tabular text-[36px] font-bold leading-none" data-testid="reading-value">
          {describeReading(reading.entry, reading.verdict)}
        </span>
        <VerdictBadge verdict={reading.verdict} />
      </div>
      {reading.limitText && (
        <div className="text-[22px]" data-testid="reading-limit">
          <span className="text-ink-muted">{t('reading.band')}</span>
          {reading.limitText}
        </div>
      )}
      {marks && unit && (
        <div className="text-[22px] text-ink-muted">
          {t('reading.marks', {
            minimum: valueWords(marks.minimum, unit),
            normal: valueWords(marks.normal, unit),
            maximum: valueWords(marks.maximum, unit),
          })}
          {marks.isolation !== undefined
            ? t('reading.isolation', { value: valueWords(marks.isolation, unit) })
            : ''}
        </div>
      )}
      <div className="text-[22px] leading-snug" data-recorded-words>
        {reading.message}
      </div>
      {reading.action && reading.action !== 'None.' && (
        <div className="text-[22px] leading-snug text-ink-muted">
          {t('reading.next', { action: reading.action })}
        </div>
      )}
      {reading.expected !== null && unit && (
        <div className="text-[22px] text-ink-muted">
          {t('reading.expected', { value: valueWords(reading.expected, unit) })}
        </div>
      )}
      {reading.reference && (
        <div className="text-[20px] text-ink-muted">
          {t('reading.reference', { reference: reading.reference })}
        </div>
      )}
      {reading.photos.length > 0 && (
        <div className="flex flex-wrap gap-3" aria-label={t('reading.photos', { label: reading.label })}>
          {reading.photos.map((photo, index) => (
            <a key={photo.id} href={`/api/photos/${photo.id}`} target="_blank" rel="noreferrer">
              <img
                src={`/api/photos/${photo.id}`}
                alt={`Photo ${index + 1} of ${reading.label}`}
                className="h-[180px] w-auto rounded-lg border-2 border-ink-line object-cover"
              />
            </a>
          ))}
        </div>
      )}
    </li>
  );
}
