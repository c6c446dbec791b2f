import { systemWords } from '@shared/domain/words';
import { checkKindLabels } from '@shared/schemas/plain';
import { limitsCaution } from '@shared/schemas/limits';
import { valueWords } from '@shared/domain/words';
import { errorMessage } from '@/lib/api-client';
import { Notice } from '@/components/ui/notice';
import { ReadingAgainstLimitsRow } from '@/components/ui/reading-against-limits';
import { ShapeIcon } from '@/components/ui/shapes';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { useHold } from '../api/get-hold';
import { CorrectiveActionForm } from './corrective-action-form';
import { CountersignPanel } from './countersign-panel';
import { HoldInspectionForm } from './hold-inspection-form';
import { recordTime } from '@/lib/when';
import { useTranslation } from 'react-i18next';

/** One hold: what was found against which limits, what was done, and the countersign that closes it. */
export function HoldDetailView({
  holdId,
  channel,
  userId,
  canCountersign,
}: {
  holdId: number;
  channel: 'kiosk' | 'desk';
  userId: number;
  /** Shift leads countersign; a mechanic may open the hold to sign the independent inspection. */
  canCountersign: boolean;
}) {
  const { t, i18n } = useTranslation('holds');
  const query = useHold(holdId);
  if (query.isPending) return <p className="text-lead text-ink-muted">{t('detail.loading')}</p>;
  if (query.isError)
    return (
      <Notice tone="warning" title={t('detail.notLoaded')}>
        {errorMessage(query.error)}
      </Notice>
    );
  const hold = query.data;
  const released = hold.state === 'released';
  const ownCheck = hold.raisedBy.id === userId;
  const notInLimits = hold.readings.filter((r) => r.verdict !== 'in_limits');
  const inLimits = hold.readings.filter((r) => r.verdict === 'in_limits');

  return (
    <div className="flex flex-col gap-6" data-testid="hold-detail" data-hold-state={hold.state}>
      <header className="flex flex-wrap items-center gap-x-6 gap-y-3">
        <span className="tabular text-[80px] font-bold leading-none">{hold.airframe.fleetNumber}</span>
        {hold.airframe.registration && (
          <span className="text-[40px] font-semibold leading-none" data-testid="hold-registration">
            {hold.airframe.registration}
          </span>
        )}
        <span className="text-[26px] text-ink-muted">{hold.airframe.typeCode}</span>
        {/* The hold's own state in word + shape + colour; the airframe's state is on the board. */}
        <span
          data-testid="hold-state"
          className={`inline-flex items-center gap-3 rounded-lg px-4 py-2 text-[30px] font-bold uppercase tracking-wide ${released ? 'border-2 border-normal-edge bg-ink-raised text-normal-text' : 'border-2 border-warning-edge bg-warning text-white [--shape-ink:#8f1d17]'}`}
        >
          <ShapeIcon shape={released ? 'ring-check' : 'octagon'} size={36} />
          {released ? t('detail.closed') : t('detail.onHold')}
        </span>
        {channel === 'desk' && (
          <a
            className="ml-auto text-[20px] underline"
            href={`/api/holds/${hold.id}.pdf?lang=${i18n.resolvedLanguage ?? 'en'}`}
            target="_blank"
            rel="noreferrer"
          >
            {t('detail.pdf')}
          </a>
        )}
      </header>
      <div className="text-[30px] font-semibold leading-tight text-warning-text" data-server-words>
        {hold.reason}
      </div>
      <p className="text-[22px]">
        {checkKindLabels[hold.check.kind]} {t('detail.signedBy')} <strong>{hold.raisedBy.name}</strong>{' '}
        {t('detail.badge', { badge: hold.check.signedBy.badgeNumber })} {recordTime(hold.check.signedAt)} ·{' '}
        {t('detail.since', { at: recordTime(hold.openedAt) })} ·{' '}
        {t('detail.limitsVersion', {
          type: hold.check.limitsVersion.typeCode,
          version: hold.check.limitsVersion.version,
        })}
      </p>

      {released && (
        <Notice
          tone="normal"
          big
          title={t('detail.releasedBy', {
            name: hold.releasedBy?.name ?? t('detail.aShiftLead'),
            at: hold.releasedAt ? recordTime(hold.releasedAt) : '',
          })}
        >
          {t('detail.releasedText')}
        </Notice>
      )}

      <div className="grid gap-6 landscape:grid-cols-[minmax(0,1fr)_minmax(0,460px)]">
        <div className="flex min-w-0 flex-col gap-6">
          <section className="flex flex-col gap-3" aria-label={t('detail.readings')}>
            <h2 className="flex items-center gap-4 text-[30px] font-bold">
              {t('detail.readings')} <VerdictBadge verdict={hold.check.verdict} />
            </h2>
            <ul className="flex flex-col gap-3">
              {[...notInLimits, ...inLimits].map((reading) => (
                <ReadingAgainstLimitsRow key={reading.code} reading={reading} />
              ))}
            </ul>
          </section>
          {hold.check.note && (
            <section className="flex flex-col gap-2">
              <h2 className="text-[28px] font-bold">{t('detail.note')}</h2>
              <p className="rounded-xl border-2 border-ink-line bg-ink-soft p-4 text-[24px]">
                {hold.check.note}
              </p>
            </section>
          )}
          <section className="flex flex-col gap-2">
            <h2 className="text-[28px] font-bold">{t('detail.fluid')}</h2>
            {hold.check.servicing.length === 0 ? (
              <p className="text-[22px] text-ink-muted">{t('detail.noneRecorded')}</p>
            ) : (
              <ul className="flex flex-col gap-2 text-[22px]">
                {hold.check.servicing.map((s) => (
                  <li key={s.code} className="rounded-xl border-2 border-ink-line bg-ink-soft p-3">
                    <strong>{valueWords(s.quantityL, 'L', 2)}</strong> {s.fluidSpec},{' '}
                    {t('detail.batch', { batch: s.batch })} · {systemWords(s.system)}
                  </li>
                ))}
              </ul>
            )}
          </section>
        </div>

        <div className="flex min-w-0 flex-col gap-6">
          <section
            className="flex flex-col gap-3 rounded-2xl border-2 border-ink-line bg-ink-soft p-5"
            aria-label={t('detail.correctiveAction')}
          >
            <h2 className="text-[32px] font-bold">{t('detail.correctiveAction')}</h2>
            {hold.correctiveActions.length === 0 && (
              <p className="text-[22px] text-caution-text">{t('detail.noneYet')}</p>
            )}
            <ul className="flex flex-col gap-3" data-testid="corrective-actions">
              {hold.correctiveActions.map((action) => (
                <li key={action.id} className="rounded-xl border-2 border-ink-line bg-ink p-3">
                  <div className="whitespace-pre-wrap text-[22px]">{action.text}</div>
                  <div className="text-[20px] text-ink-muted">
                    {action.recordedBy.name} · {recordTime(action.recordedAt)}
                  </div>
                </li>
              ))}
            </ul>
            {!released && <CorrectiveActionForm holdId={hold.id} channel={channel} />}
          </section>

          {hold.countersigns.length > 0 && (
            <section className="flex flex-col gap-2" aria-label={t('detail.countersigns')}>
              <h2 className="text-[28px] font-bold">{t('detail.countersigns')}</h2>
              <ul className="flex flex-col gap-2 text-[22px]">
                {hold.countersigns.map((c) => (
                  <li key={c.id} className="rounded-xl border-2 border-ink-line bg-ink-soft p-3">
                    <strong>{c.decision === 'release' ? t('detail.released') : t('detail.kept')}</strong>{' '}
                    {t('detail.by', { name: c.signedBy.name })} · {recordTime(c.signedAt)} ·{' '}
                    {c.signedWith === 'pin' ? t('detail.withPin') : t('detail.withPassword')}
                    {c.reason ? <div>{c.reason}</div> : null}
                  </li>
                ))}
              </ul>
            </section>
          )}

          {!released && (
            <>
              {ownCheck && canCountersign && (
                <Notice tone="caution" title={t('detail.ownCheck')}>
                  {t('detail.ownCheckText')}
                </Notice>
              )}
              {hold.releaseReadiness.independentInspection.needed && (
                <HoldInspectionForm hold={hold} channel={channel} userId={userId} />
              )}
              {canCountersign && <CountersignPanel hold={hold} channel={channel} />}
            </>
          )}
        </div>
      </div>
      <p className="text-[20px] text-ink-muted">
        {hold.caution === limitsCaution ? t('limitsCaution', { ns: 'words' }) : hold.caution}
      </p>
    </div>
  );
}
