import { systemWords } from '@shared/domain/words';
import { typeWords } from '@shared/domain/words';
import type { ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import type { AcceptanceView } from '@shared/schemas/acceptance';
import { valueWords } from '@shared/domain/words';
import { errorMessage } from '@/lib/api-client';
import { Notice } from '@/components/ui/notice';
import { ReadingAgainstLimitsRow } from '@/components/ui/reading-against-limits';
import { DefectLines, defectsBesideHolds, ReleaseLine } from '@/components/ui/defect-lines';
import { StateBadge } from '@/components/ui/state-badge';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { useAcceptanceView } from '../api/get-acceptance-view';
import { AcceptancePanel } from './acceptance-panel';
import { FlightClosePanel } from './flight-close-panel';
import { localTime } from '@/lib/when';
import { checkKindLabel } from '@shared/schemas/plain';
import { phraseWords } from '@shared/i18n/phrase';
import { ReasonItems } from '@/components/ui/reason-items';

// Each kind of check's name in the acceptance catalogue (the kind stays a code in what is stored and signed).
type LatestCheck = AcceptanceView['latestChecks'][number];

/** What a check found, in the pilot's words: a finding is not "valid" to a pilot until the state says it is cleared. */
const findingKey = (check: LatestCheck) =>
  check.verdict === 'service'
    ? 'check.foundService'
    : check.verdict === 'out_of_limits'
      ? 'check.foundOutOfLimits'
      : check.valid
        ? 'check.stillValid'
        : 'check.expired';

/**
 * What a pilot needs before accepting: the state and why, defects and their deferral limits, whether a certificate
 * of release to service is in force, the checks it rests on with their readings, fluid added and holds.
 * `actions`: what else the pilot may do here, for example raise a defect.
 */
export function PilotAirframeView({
  airframeId,
  actions,
}: {
  airframeId: number;
  actions?: (view: AcceptanceView) => ReactNode;
}) {
  const query = useAcceptanceView(airframeId);
  const { t } = useTranslation('acceptance');
  if (query.isPending) return <p className="text-lead text-ink-muted">{t('view.loading')}</p>;
  if (query.isError)
    return (
      <Notice tone="warning" title={t('view.notLoaded')}>
        {errorMessage(query.error)}
      </Notice>
    );
  const view = query.data;
  const defects = defectsBesideHolds(view);
  return (
    <div className="flex flex-col gap-6" data-testid="pilot-view" data-state={view.state}>
      <header className="flex flex-wrap items-center gap-x-6 gap-y-3">
        <span className="tabular text-[88px] font-bold leading-none">{view.airframe.fleetNumber}</span>
        <StateBadge state={view.state} causes={view.causes} size="xl" />
        <span className="text-[24px] text-ink-muted">
          {t('view.identity', {
            type: typeWords(view.airframe.type),
            serial: view.airframe.serial,
            hours: view.airframe.hours,
          })}
        </span>
      </header>
      {view.stateReasons.length > 0 && (
        <ul className="flex flex-col gap-1 text-[24px]" aria-label={t('view.whyThisState')}>
          <ReasonItems reasons={view.stateReasons} />
        </ul>
      )}
      <ReleaseLine release={view.release} className="text-[26px]" />

      <div className="grid gap-6 landscape:grid-cols-[minmax(0,1fr)_minmax(0,420px)]">
        <div className="flex flex-col gap-4 landscape:order-2">
          <AcceptancePanel view={view} />
          <FlightClosePanel view={view} />
          {defects.length > 0 && (
            <section
              className="flex flex-col gap-3 rounded-2xl border-2 border-caution-edge bg-ink-soft p-4"
              aria-label={t('view.defects')}
              data-testid="pilot-defects"
            >
              <h2 className="text-[28px] font-bold">{t('view.defects')}</h2>
              <DefectLines defects={defects} now={query.dataUpdatedAt} />
              <ul className="flex flex-col gap-1 text-[20px] text-ink-muted">
                {defects.map((defect) => (
                  <li key={defect.id}>
                    {t('view.defectLine', { number: defect.number, reason: phraseWords(defect.reason) })}
                  </li>
                ))}
              </ul>
            </section>
          )}
          {actions?.(view)}
          {view.lastAcceptance && (
            <p className="text-[22px] text-normal-text" data-testid="last-acceptance">
              {t('view.lastAccepted', {
                name: view.lastAcceptance.by,
                at: localTime(view.lastAcceptance.at),
              })}
            </p>
          )}
          {view.openHolds.length > 0 && (
            <section
              className="flex flex-col gap-2 rounded-2xl border-2 border-warning-edge bg-ink-soft p-4"
              aria-label={t('view.openHolds')}
            >
              <h2 className="text-[28px] font-bold text-warning-text">{t('view.openHolds')}</h2>
              <ul className="flex flex-col gap-2 text-[22px]">
                {view.openHolds.map((hold) => (
                  <li key={hold.id}>
                    <strong>{hold.reason}</strong> {t('view.holdSince', { at: localTime(hold.openedAt) })}
                  </li>
                ))}
              </ul>
            </section>
          )}
          <section
            className="flex flex-col gap-2 rounded-2xl border-2 border-ink-line bg-ink-soft p-4"
            aria-label={t('view.fluidLabel')}
          >
            <h2 className="text-[26px] font-bold">{t('view.fluidTitle')}</h2>
            {view.fluidAdded.length === 0 ? (
              <p className="text-[22px] text-ink-muted">{t('view.none')}</p>
            ) : (
              <ul className="flex flex-col gap-1 text-[22px]">
                {view.fluidAdded.map((fluid) => (
                  <li key={`${fluid.checkId}-${fluid.code}`}>
                    <strong className="tabular">{valueWords(fluid.litres, 'L', 2)}</strong>{' '}
                    {systemWords(fluid.system)}
                    {fluid.fluidSpec ? `, ${fluid.fluidSpec}` : ''}
                    {fluid.batch ? t('view.batch', { batch: fluid.batch }) : ''} · {localTime(fluid.at)}
                  </li>
                ))}
              </ul>
            )}
          </section>
        </div>

        <section
          className="flex min-w-0 flex-col gap-5 landscape:order-1"
          aria-label={t('view.latestChecks')}
        >
          <h2 className="text-[30px] font-bold">{t('view.latestChecks')}</h2>
          {view.latestChecks.length === 0 && (
            <p className="text-[24px] text-caution-text">{t('view.noCheck')}</p>
          )}
          {view.latestChecks.map((check) => (
            <article key={check.id} className="flex flex-col gap-3" data-testid={`pilot-check-${check.kind}`}>
              <div className="flex flex-wrap items-center gap-4">
                <h3 className="text-[28px] font-bold">{checkKindLabel(check.kind)}</h3>
                <VerdictBadge verdict={check.verdict} />
                {/* A check with a finding is not "valid" to a pilot: the state above says whether it is cleared. */}
                <span
                  className={`text-[22px] font-semibold ${check.valid && check.verdict === 'in_limits' ? '' : 'text-caution-text'}`}
                >
                  {t(findingKey(check))} · {phraseWords(check.validity)}
                </span>
              </div>
              <p className="text-[22px] text-ink-muted">
                {t(check.signedBy.licenceNumber ? 'check.signedWithLicence' : 'check.signed', {
                  name: check.signedBy.name,
                  licence: check.signedBy.licenceNumber,
                  at: localTime(check.signedAt),
                  typeCode: check.limitsVersion.typeCode,
                  version: check.limitsVersion.version,
                })}
              </p>
              <ul className="flex flex-col gap-3">
                {check.readings.map((reading) => (
                  <ReadingAgainstLimitsRow key={reading.code} reading={reading} />
                ))}
              </ul>
            </article>
          ))}
        </section>
      </div>
      <Notice tone="info" title={t('view.limitsSource')}>
        {view.caution}
      </Notice>
    </div>
  );
}
