import type { AirframeSummary } from '@shared/schemas/airframes';
import { DefectLines, defectsBesideHolds, findingReasons } from './defect-lines';
import { ShapeIcon } from './shapes';
import { StateBadge } from './state-badge';
import { useTranslation } from 'react-i18next';
import { phraseWords } from '@shared/i18n/phrase';

/** The top of an airframe tile on the kiosk: fleet number, state, type and base. */
export function AirframeHeading({ airframe }: { airframe: AirframeSummary }) {
  return (
    <>
      <div className="flex w-full flex-wrap items-start justify-between gap-2">
        <span className="tabular text-fleet font-bold">{airframe.fleetNumber}</span>
        <StateBadge state={airframe.state} causes={airframe.causes} />
      </div>
      <div className="text-[22px] text-ink-muted">
        {airframe.type.code} · {airframe.base.name}
      </div>
    </>
  );
}

/** Why an airframe is not simply serviceable: its holds, its findings and its defects. */
export function AirframeFindings({ airframe, now }: { airframe: AirframeSummary; now: number }) {
  const { t } = useTranslation('common');
  return (
    <>
      {airframe.openHolds.length > 0 && (
        <div className="text-[22px] font-semibold text-warning-text" data-server-words>
          {t('airframeLines.hold', { reasons: airframe.openHolds.map((hold) => hold.reason).join('; ') })}
        </div>
      )}
      {findingReasons(airframe).map((reason) => (
        <div key={reason} className="text-[22px] font-semibold text-warning-text">
          {reason}
        </div>
      ))}
      <DefectLines defects={defectsBesideHolds(airframe)} now={now} />
      <FluidAlertLines airframe={airframe} />
    </>
  );
}

/**
 * Fluid alerts of the airframe (a level that fell with nothing flown), in amber with a triangle and the word: an
 * alert to look into before flight, not a finding, so it sits beside the state and never changes it.
 */
export function FluidAlertLines({
  airframe,
  theme = 'dark',
  className = 'text-[22px]',
}: {
  airframe: Pick<AirframeSummary, 'fluidAlerts'>;
  theme?: 'dark' | 'light';
  className?: string;
}) {
  const { t } = useTranslation('common');
  if (!airframe.fluidAlerts || airframe.fluidAlerts.length === 0) return null;
  return (
    <ul
      className={`flex flex-col gap-1 font-semibold leading-snug ${theme === 'dark' ? 'text-caution-text' : 'text-caution'} ${className}`}
      aria-label={t('airframeLines.fluidAlerts')}
      data-testid="fluid-alerts"
    >
      {airframe.fluidAlerts.map((alert) => (
        <li key={alert.system} className="flex items-start gap-2" title={phraseWords(alert.message)}>
          <ShapeIcon shape="triangle" size={28} className="mt-1" />
          <span className="line-clamp-3">
            {t('airframeLines.fluidAlert', { message: phraseWords(alert.message) })}
          </span>
        </li>
      ))}
    </ul>
  );
}
