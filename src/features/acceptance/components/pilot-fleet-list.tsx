import { useTranslation } from 'react-i18next';
import { Link } from 'react-router-dom';
import { errorMessage } from '@/lib/api-client';
import { Notice } from '@/components/ui/notice';
import { ReleaseLine, showsRelease } from '@/components/ui/defect-lines';
import { stateEdgeLeft } from '@/components/ui/state-badge';
import { AirframeFindings, AirframeHeading } from '@/components/ui/airframe-lines';
import { localTime } from '@/lib/when';
import { useAirframes } from '@/lib/shared-queries';

/** The pilot picks the aircraft to fly; each tile already says whether it may be accepted, and why not. */
export function PilotFleetList({ hrefFor }: { hrefFor: (airframeId: number) => string }) {
  const fleet = useAirframes();
  const { t } = useTranslation('acceptance');
  if (fleet.isPending) return <p className="text-lead text-ink-muted">{t('fleet.loading')}</p>;
  if (fleet.isError)
    return (
      <Notice tone="warning" title={t('fleet.notLoaded')}>
        {errorMessage(fleet.error)}
      </Notice>
    );
  return (
    <ul className="grid gap-4 landscape:grid-cols-2" aria-label={t('fleet.listLabel')}>
      {fleet.data.map((airframe) => (
        <li key={airframe.id} className="contents">
          <Link
            to={hrefFor(airframe.id)}
            data-testid={`pilot-airframe-${airframe.fleetNumber}`}
            className={`flex min-h-[160px] flex-col gap-2 rounded-xl border-2 border-l-[12px] border-ink-line bg-ink-soft p-4 active:scale-[0.99] ${stateEdgeLeft[airframe.state]}`}
          >
            <AirframeHeading airframe={airframe} />
            <AirframeFindings airframe={airframe} now={fleet.dataUpdatedAt} />
            {showsRelease(airframe) && <ReleaseLine release={airframe.release} className="text-[22px]" />}
            {airframe.lastAcceptance && (
              <div className="text-[22px] text-normal-text">
                {t('fleet.acceptedBy', {
                  name: airframe.lastAcceptance.by,
                  at: localTime(airframe.lastAcceptance.at, airframe.base.timeZone),
                })}
              </div>
            )}
          </Link>
        </li>
      ))}
    </ul>
  );
}
