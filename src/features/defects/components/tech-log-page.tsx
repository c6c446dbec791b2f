import { localNumber, typeWords } from '@shared/domain/words';
import { Link } from 'react-router-dom';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { errorMessage } from '@/lib/api-client';
import { DefectLines, ReleaseLine, showsRelease } from '@/components/ui/defect-lines';
import { Notice } from '@/components/ui/notice';
import type { SigningChannel } from '@/components/ui/signature-entry';
import { StateBadge, stateEdgeLeft } from '@/components/ui/state-badge';
import { useAirframeDefects } from '../api/get-airframe-defects';
import { DefectCard } from './defect-card';
import { RaiseDefectPanel } from './raise-defect-panel';
import { ReleasePanel } from './release-panel';
import { useTranslation } from 'react-i18next';
import { ReasonItems } from '@/components/ui/reason-items';

function AirframeTechLog({
  airframe,
  channel,
  canAct,
  holdHref,
}: {
  airframe: AirframeSummary;
  channel: SigningChannel;
  canAct: boolean;
  holdHref: (holdId: number) => string;
}) {
  const { t } = useTranslation('defects');
  const defects = useAirframeDefects(airframe.id);
  const standing = defects.data?.filter((d) => d.status !== 'rectified') ?? [];
  const rectified = defects.data?.filter((d) => d.status === 'rectified') ?? [];
  return (
    <div className="flex min-w-0 flex-col gap-5" data-testid="tech-log" data-fleet={airframe.fleetNumber}>
      <header className="flex flex-wrap items-center gap-x-5 gap-y-2">
        <h2 className="tabular text-fleet font-bold">{airframe.fleetNumber}</h2>
        <span className="text-[22px] text-ink-muted">
          {t('techLog.summary', {
            type: typeWords(airframe.type),
            hours: localNumber(airframe.hours, 1),
            flights: t('techLog.flights', { count: airframe.flights }),
          })}
        </span>
        <StateBadge state={airframe.state} causes={airframe.causes} size="lg" />
      </header>
      {airframe.stateReasons.length > 0 && (
        <ul className="flex flex-col gap-1 text-[22px]" aria-label={t('techLog.why')}>
          <ReasonItems reasons={airframe.stateReasons} />
        </ul>
      )}
      <ReleasePanel airframe={airframe} channel={channel} canSign={canAct} />
      <section className="flex flex-col gap-4" aria-label={t('techLog.defects')}>
        <div className="flex flex-wrap items-center gap-4">
          <h2 className="mr-auto text-[30px] font-bold">
            {t('techLog.notRectified', { count: standing.length })}
          </h2>
        </div>
        {canAct && (
          <RaiseDefectPanel
            airframeId={airframe.id}
            fleetNumber={airframe.fleetNumber}
            channel={channel}
            maintenance
          />
        )}
        {defects.isPending && <p className="text-[22px] text-ink-muted">{t('techLog.loading')}</p>}
        {defects.isError && (
          <Notice tone="warning" title={t('techLog.notLoaded')}>
            {errorMessage(defects.error)}
          </Notice>
        )}
        {defects.data && standing.length === 0 && (
          <p className="text-[22px] text-ink-muted">{t('techLog.none', { fleet: airframe.fleetNumber })}</p>
        )}
        {standing.map((defect) => (
          <DefectCard key={defect.id} defect={defect} channel={channel} canAct={canAct} holdHref={holdHref} />
        ))}
        {rectified.length > 0 && (
          <details>
            <summary className="min-h-touch cursor-pointer py-4 text-[24px] font-semibold">
              {t('techLog.rectified', { count: rectified.length })}
            </summary>
            <div className="flex flex-col gap-4">
              {rectified.map((defect) => (
                <DefectCard
                  key={defect.id}
                  defect={defect}
                  channel={channel}
                  canAct={false}
                  holdHref={holdHref}
                />
              ))}
            </div>
          </details>
        )}
      </section>
    </div>
  );
}

/**
 * The tech log per airframe: pick an airframe on the left (unserviceable first, as the board orders them), then its
 * defects with their entries, the acts on them, and its certificate of release to service.
 */
export function TechLogPage({
  airframes,
  selectedId,
  hrefFor,
  listHref,
  channel,
  canAct,
  holdHref,
  now,
}: {
  airframes: AirframeSummary[];
  selectedId: number | null;
  hrefFor: (airframeId: number) => string;
  listHref: string;
  channel: SigningChannel;
  canAct: boolean;
  holdHref: (holdId: number) => string;
  now: number;
}) {
  const { t } = useTranslation('defects');
  const selected = airframes.find((a) => a.id === selectedId) ?? null;
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,400px)_minmax(0,1fr)]">
      {/* In one column (a portrait tablet) the chosen airframe's tech log comes first; the list is a tap away. */}
      <nav
        aria-label={t('techLog.airframes')}
        className={`flex-col gap-3 ${selected ? 'hidden lg:flex' : 'flex'}`}
      >
        {airframes.map((airframe) => (
          <Link
            key={airframe.id}
            to={hrefFor(airframe.id)}
            aria-current={airframe.id === selectedId ? 'page' : undefined}
            data-testid={`tech-log-airframe-${airframe.fleetNumber}`}
            className={`flex min-h-touch flex-col gap-2 rounded-xl border-2 border-l-[10px] bg-ink-soft p-3 ${stateEdgeLeft[airframe.state]} ${airframe.id === selectedId ? 'border-signal-edge ring-4 ring-signal-edge' : 'border-ink-line'}`}
          >
            <div className="flex flex-wrap items-center justify-between gap-2">
              <span className="tabular text-[36px] font-bold">{airframe.fleetNumber}</span>
              <StateBadge state={airframe.state} causes={airframe.causes} />
            </div>
            <DefectLines defects={airframe.defects} now={now} timeZone="UTC" />
            {showsRelease(airframe) && (
              <ReleaseLine release={airframe.release} className="text-[20px]" timeZone="UTC" />
            )}
          </Link>
        ))}
      </nav>
      {selected ? (
        <div className="flex min-w-0 flex-col gap-4">
          <Link
            to={listHref}
            className="inline-flex min-h-touch items-center self-start rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold lg:hidden"
          >
            {t('techLog.allAirframes')}
          </Link>
          <AirframeTechLog
            key={selected.id}
            airframe={selected}
            channel={channel}
            canAct={canAct}
            holdHref={holdHref}
          />
        </div>
      ) : (
        <Notice tone="info" title={t('techLog.pick')}>
          {t('techLog.pickText')}
        </Notice>
      )}
    </div>
  );
}
