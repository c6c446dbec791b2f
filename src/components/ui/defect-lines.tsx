import { ambientTranslate, say } from '@shared/i18n/translate';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { DefectSummary } from '@shared/schemas/defects';
import { localTime, timeLeft } from '@/lib/when';
import { ShapeIcon, type Shape } from './shapes';
import { useTranslation } from 'react-i18next';
import { phraseWords } from '@shared/i18n/phrase';

type Theme = 'dark' | 'light';

const statusLook: Record<
  DefectSummary['status'],
  { shape: Shape; word: `common:defectLines.${string}`; dark: string; light: string }
> = {
  open: {
    shape: 'octagon',
    word: 'common:defectLines.open',
    dark: 'text-warning-text',
    light: 'text-warning',
  },
  deferral_expired: {
    shape: 'octagon',
    word: 'common:defectLines.expired',
    dark: 'text-warning-text',
    light: 'text-warning',
  },
  deferred: {
    shape: 'triangle',
    word: 'common:defectLines.deferred',
    dark: 'text-caution-text',
    light: 'text-caution',
  },
};

/** The defects to list beside the open holds: a finding out of limits is a defect of its hold, which says it. */
export function defectsBesideHolds(
  airframe: Pick<AirframeSummary, 'defects' | 'openHolds'>,
): DefectSummary[] {
  const held = new Set(airframe.openHolds.map((hold) => hold.id));
  return airframe.defects.filter((defect) => defect.holdId === null || !held.has(defect.holdId));
}

/**
 * The findings that have no hold line of their own (a reading needing service, or out of limits with no hold), in
 * the screen's language.
 */
export const findingReasons = (airframe: Pick<AirframeSummary, 'findings'>) =>
  airframe.findings.filter((finding) => !finding.held).map((finding) => phraseWords(finding.phrase));

/** A release line says something only once the airframe has been checked or released. */
export const showsRelease = (airframe: Pick<AirframeSummary, 'state' | 'release'>) =>
  airframe.release !== null || airframe.state !== 'not_checked';

/** What the defect's limit leaves: a countdown to its last instant, or its limit in hours or flights. */
export function deferralLeft(defect: DefectSummary, now: number, timeZone?: string): string {
  const t = (key: string, values?: Record<string, unknown>) =>
    say(ambientTranslate(), `common:defectLines.${key}`, values);
  if (defect.status === 'open') return t('notRectified');
  if (defect.status === 'deferral_expired')
    return defect.deferredUntil
      ? t('ranOut', { at: localTime(defect.deferredUntil, timeZone) })
      : t('limitPassed');
  if (defect.deferredUntil) {
    const left = timeLeft(defect.deferredUntil, now);
    return left.past ? t('limitReached') : t('left', { time: left.text });
  }
  return phraseWords(defect.reason);
}

/**
 * Open and deferred defects, one line each: number, status in word + shape, what was found, and the deferral's
 * countdown. Used where the airframe's state is shown (board, kiosk, pilot).
 */
export function DefectLines({
  defects,
  now,
  theme = 'dark',
  size = 'md',
  timeZone,
}: {
  defects: readonly DefectSummary[];
  now: number;
  theme?: Theme;
  size?: 'md' | 'lg';
  /** The clock times are written in; the hangar's by default. */
  timeZone?: string;
}) {
  const { t } = useTranslation('common');
  if (defects.length === 0) return null;
  const text = size === 'lg' ? 'text-[26px]' : 'text-[22px]';
  const icon = size === 'lg' ? 30 : 24;
  return (
    <ul
      className={`flex flex-col gap-1 ${text} leading-snug`}
      aria-label={t('defectLines.label')}
      data-testid="defect-lines"
    >
      {defects.map((defect) => {
        const look = statusLook[defect.status];
        return (
          <li
            key={defect.id}
            data-testid={`defect-${defect.number}`}
            data-status={defect.status}
            className="flex min-w-0 items-start gap-2"
          >
            <ShapeIcon shape={look.shape} size={icon} className={`mt-0.5 ${look[theme]}`} />
            <span className="flex min-w-0 flex-col">
              <span>
                <strong className={look[theme]}>
                  {t('defectLines.defect', { number: defect.number })} · {say(t, look.word)}
                </strong>
                {defect.status !== 'open' && (
                  <span
                    className={`font-semibold ${defect.status === 'deferral_expired' ? look[theme] : ''}`}
                    data-testid="deferral-left"
                  >
                    {' '}
                    · {deferralLeft(defect, now, timeZone)}
                  </span>
                )}
              </span>
              <span className="line-clamp-1 break-words" title={defect.description} data-recorded-words>
                {defect.description}
              </span>
            </span>
          </li>
        );
      })}
    </ul>
  );
}

/** "Released by Jonah Pell 2 Dec 2026, 14:05 WET", or that no certificate of release to service is in force. */
export function ReleaseLine({
  release,
  theme = 'dark',
  className = '',
  timeZone,
}: {
  release: AirframeSummary['release'];
  theme?: Theme;
  className?: string;
  timeZone?: string;
}) {
  const { t } = useTranslation('common');
  const muted = theme === 'dark' ? 'text-ink-muted' : 'text-paper-muted';
  const good = theme === 'dark' ? 'text-normal-text' : 'text-normal';
  return release ? (
    <div
      data-testid="release-line"
      className={`flex items-center gap-2 font-semibold ${good} ${theme === 'light' ? '[--shape-ink:#ffffff]' : ''} ${className}`}
    >
      <ShapeIcon shape="circle-check" size={26} className={good} />
      {t('defectLines.releasedBy', { name: release.by, at: localTime(release.at, timeZone) })}
    </div>
  ) : (
    <div data-testid="release-line" className={`flex items-center gap-2 ${muted} ${className}`}>
      <ShapeIcon shape="dashed" size={26} />
      {t('defectLines.noRelease')}
    </div>
  );
}
