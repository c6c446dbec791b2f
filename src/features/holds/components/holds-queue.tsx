import { Link } from 'react-router-dom';
import { checkKindLabels } from '@shared/schemas/plain';
import { errorMessage } from '@/lib/api-client';
import { Notice } from '@/components/ui/notice';
import { ShapeIcon } from '@/components/ui/shapes';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { recordTime } from '@/lib/when';
import { describeReading } from '@/lib/describe-entry';
import { useHolds } from '../api/get-holds';
import { useTranslation } from 'react-i18next';

/** Every open hold, oldest first, readable from across the desk: fleet number, why, who found it, whether a re-check passed. */
export function HoldsQueue({ hrefFor }: { hrefFor: (holdId: number) => string }) {
  const { t } = useTranslation('holds');
  const holds = useHolds();
  if (holds.isPending) return <p className="text-lead text-ink-muted">{t('queue.loading')}</p>;
  if (holds.isError)
    return (
      <Notice tone="warning" title={t('queue.notLoaded')}>
        {errorMessage(holds.error)}
      </Notice>
    );
  if (holds.data.length === 0)
    return (
      <Notice tone="normal" big title={t('queue.none')}>
        {t('queue.noneText')}
      </Notice>
    );
  return (
    <ol className="flex flex-col gap-4" aria-label={t('queue.label')}>
      {holds.data.map((hold) => (
        <li key={hold.id}>
          <Link
            to={hrefFor(hold.id)}
            data-testid={`hold-${hold.airframe.fleetNumber}`}
            className="grid grid-cols-[auto_1fr] items-start gap-x-6 gap-y-2 rounded-2xl border-2 border-l-[14px] border-ink-line border-l-warning-edge bg-ink-soft p-5 active:scale-[0.99] portrait:grid-cols-1"
          >
            <div className="flex flex-col gap-2">
              <span className="tabular text-fleet font-bold">{hold.airframe.fleetNumber}</span>
              <span className="text-[22px] text-ink-muted">{hold.airframe.typeCode}</span>
            </div>
            <div className="flex min-w-0 flex-col gap-2">
              <div className="text-[28px] font-semibold leading-tight text-warning-text" data-server-words>
                {hold.reason}
              </div>
              <div className="text-[22px]">
                {t('queue.foundBy')} <strong>{hold.check.signedBy.name}</strong> ·{' '}
                {checkKindLabels[hold.check.kind]}{' '}
                {t('queue.signed', { at: recordTime(hold.check.signedAt) })} ·{' '}
                {t('queue.since', { at: recordTime(hold.openedAt) })}
              </div>
              {hold.findings.map((finding) => (
                <div key={finding.code} className="flex flex-wrap items-center gap-3 text-[22px]">
                  <VerdictBadge verdict={finding.verdict} />
                  <span>
                    {finding.label}:{' '}
                    <strong className="tabular">{describeReading(finding.entry, finding.verdict)}</strong>
                    {finding.limitText ? t('queue.limit', { limit: finding.limitText }) : ''}
                  </span>
                </div>
              ))}
              <div className="flex flex-wrap gap-3 text-[22px] font-semibold">
                {hold.recheckPassed ? (
                  <span
                    className="inline-flex items-center gap-2 text-normal-text"
                    data-testid="recheck-passed"
                  >
                    <ShapeIcon shape="circle-check" size={28} /> {t('queue.recheckPassed')}
                  </span>
                ) : (
                  <span
                    className="inline-flex items-center gap-2 text-caution-text"
                    data-testid="recheck-missing"
                  >
                    <ShapeIcon shape="triangle" size={28} /> {t('queue.recheckMissing')}
                  </span>
                )}
                <span className="text-ink-muted">
                  ·{' '}
                  {hold.correctiveActionCount === 0
                    ? t('queue.noAction')
                    : t('queue.actions', { count: hold.correctiveActionCount })}
                </span>
                {hold.lastCountersign?.decision === 'keep' && (
                  <span className="text-ink-muted">
                    ·{' '}
                    {t('queue.keptBy', {
                      name: hold.lastCountersign.by,
                      reason: hold.lastCountersign.reason,
                    })}
                  </span>
                )}
              </div>
            </div>
          </Link>
        </li>
      ))}
    </ol>
  );
}
