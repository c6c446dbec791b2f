import { localNumber, systemWords } from '@shared/domain/words';
import { limitsCaution } from '@shared/schemas/limits';
import { useMemo, useState } from 'react';
import { checkKindLabels } from '@shared/schemas/plain';
import { errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { StateBadge } from '@/components/ui/state-badge';
import { useHandover, type ShiftWindow } from '../api/get-handover';
import { useSendHandover } from '../api/send-handover';
import { recordTime } from '@/lib/when';
import { useTranslation } from 'react-i18next';
import { phraseWords } from '@shared/i18n/phrase';
import { ReasonItems } from '@/components/ui/reason-items';

const spans = [
  { hours: 12, label: 'page.last12' },
  { hours: 24, label: 'page.last24' },
  { hours: 24 * 7, label: 'page.last7Days' },
] as const;

const litres = (value: number) => `${localNumber(value, 2)} L`;
const box = 'flex flex-col gap-3 rounded-2xl border-2 border-ink-line bg-ink-soft p-5';

/** The shift in one screen, and the same summary sent to maintenance control. */
export function HandoverPage({ canSend }: { canSend: boolean }) {
  const { t } = useTranslation('handover');
  const [hours, setHours] = useState<number>(12);
  // The shift is fixed when chosen, so the summary on screen and the one sent cover the same span.
  const [anchor, setAnchor] = useState(() => Date.now());
  const shift: ShiftWindow = useMemo(
    () => ({ from: new Date(anchor - hours * 3_600_000).toISOString(), to: new Date(anchor).toISOString() }),
    [anchor, hours],
  );
  const summary = useHandover(shift);
  const send = useSendHandover();

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center gap-3">
        {spans.map((span) => (
          <Button
            key={span.hours}
            tone={span.hours === hours ? 'primary' : 'neutral'}
            aria-pressed={span.hours === hours}
            onClick={() => {
              setHours(span.hours);
              setAnchor(Date.now());
              send.reset();
            }}
          >
            {t(span.label)}
          </Button>
        ))}
        <span className="text-[17px] text-ink-muted">
          {t('page.span', { from: recordTime(shift.from), to: recordTime(shift.to) })}
        </span>
      </div>

      {summary.isPending && <p className="text-[17px] text-ink-muted">{t('page.adding')}</p>}
      {summary.isError && (
        <Notice tone="warning" title={t('page.notLoaded')}>
          {errorMessage(summary.error)}
        </Notice>
      )}
      {summary.data && (
        <>
          <section className={box} aria-label={t('page.airframesNow')} data-testid="handover-states">
            <h2 className="text-[16px] font-bold">{t('page.airframesNow')}</h2>
            <ul className="flex flex-wrap gap-3">
              {summary.data.states.map((s) => (
                <li key={s.airframe.id} className="flex items-center gap-3 text-[18px] font-semibold">
                  <span className="tabular">{s.airframe.fleetNumber}</span>
                  <StateBadge state={s.state} causes={s.causes} />
                </li>
              ))}
            </ul>
            <h3 className="text-[18px] font-bold">{t('page.defects')}</h3>
            {summary.data.defects.length === 0 ? (
              <p className="text-[17px] text-ink-muted">{t('page.none')}</p>
            ) : (
              <ul className="flex flex-col gap-1 text-[17px]">
                {summary.data.defects.flatMap((a) =>
                  a.defects.map((d) => (
                    <li key={d.id}>
                      <strong>{a.airframe.fleetNumber}</strong>{' '}
                      {t('page.defectLine', { number: d.number, description: d.description })}{' '}
                      <span>({phraseWords(d.reason)})</span>
                    </li>
                  )),
                )}
              </ul>
            )}
          </section>
          <div className="grid gap-5 landscape:grid-cols-3" data-testid="handover-summary">
            <section className={box}>
              <h2 className="text-[16px] font-bold">
                {t('page.checks', { count: summary.data.checks.total })}
              </h2>
              <table className="text-[17px]">
                <thead className="text-left text-ink-muted">
                  <tr>
                    <th className="pr-3 font-semibold">{t('page.kind')}</th>
                    <th className="pr-3 font-semibold">{t('page.inLimits')}</th>
                    <th className="pr-3 font-semibold">{t('page.service')}</th>
                    <th className="font-semibold">{t('page.out')}</th>
                  </tr>
                </thead>
                <tbody className="tabular">
                  {summary.data.checks.byKind.map((row) => (
                    <tr key={row.kind}>
                      <td className="pr-3 font-semibold">{checkKindLabels[row.kind]}</td>
                      <td className="pr-3">{row.in_limits}</td>
                      <td className="pr-3">{row.service}</td>
                      <td className={row.out_of_limits > 0 ? 'font-bold text-warning-text' : ''}>
                        {row.out_of_limits}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </section>
            <section className={box}>
              <h2 className="text-[16px] font-bold">{t('page.holds')}</h2>
              <div className="text-[18px]">
                {t('page.opened')} <strong>{summary.data.holdsOpened.length}</strong> · {t('page.released')}{' '}
                <strong>{summary.data.holdsReleased.length}</strong> · {t('page.stillOpen')}{' '}
                <strong className={summary.data.holdsStillOpen > 0 ? 'text-warning-text' : ''}>
                  {summary.data.holdsStillOpen}
                </strong>
              </div>
              <ul className="flex flex-col gap-1 text-[17px]">
                {summary.data.holdsOpened.map((h) => (
                  <li key={`o${h.id}`}>
                    <strong>{h.airframe.fleetNumber}</strong>{' '}
                    {t('page.heldLine', { at: recordTime(h.openedAt) })}:{' '}
                    <span data-server-words>{h.reason}</span>
                  </li>
                ))}
                {summary.data.holdsReleased.map((h) => (
                  <li key={`r${h.id}`}>
                    <strong>{h.airframe.fleetNumber}</strong>{' '}
                    {t('page.releasedLine', { at: recordTime(h.releasedAt), name: h.releasedBy })}
                  </li>
                ))}
              </ul>
            </section>
            <section className={box}>
              <h2 className="text-[16px] font-bold">{t('page.fluid')}</h2>
              {summary.data.fluidUsed.bySystem.length === 0 && (
                <p className="text-[17px] text-ink-muted">{t('page.noFluid')}</p>
              )}
              <ul className="flex flex-col gap-1 text-[17px]">
                {summary.data.fluidUsed.bySystem.map((s) => (
                  <li key={s.system}>
                    {systemWords(s.system)}: <strong className="tabular">{litres(s.litres)}</strong>
                  </li>
                ))}
              </ul>
              <ul className="flex flex-col gap-1 text-[16px] text-ink-muted">
                {summary.data.fluidUsed.byAirframe.map((a) => (
                  <li key={`${a.airframe.id}-${a.system}`}>
                    {a.airframe.fleetNumber} {systemWords(a.system)}: {litres(a.litres)}
                  </li>
                ))}
              </ul>
            </section>
          </div>

          {summary.data.consumptionAlerts.length > 0 && (
            <Notice tone="caution" title={t('page.alerts')}>
              <ul className="flex flex-col gap-1">
                <ReasonItems reasons={summary.data.consumptionAlerts} />
              </ul>
            </Notice>
          )}
          {summary.data.notes.length > 0 && (
            <Notice tone="info" title={t('page.notes')}>
              <ul className="flex flex-col gap-1">
                {summary.data.notes.map((note) => (
                  <li key={note} data-server-words>
                    {note}
                  </li>
                ))}
              </ul>
            </Notice>
          )}

          {canSend ? (
            <div className="flex flex-col gap-3">
              <Button
                tone="primary"

                className="self-start"
                disabled={send.isPending}
                onClick={() => send.mutate(shift)}
              >
                {send.isPending ? t('page.sending') : t('page.send')}
              </Button>
              {send.isError && (
                <Notice tone="warning" title={t('page.notSent')}>
                  {errorMessage(send.error)}
                </Notice>
              )}
              {send.data?.status === 'sent' && (
                <Notice tone="normal" title={t('page.sentTo', { to: send.data.to.join(', ') })}>
                  {send.data.subject}
                </Notice>
              )}
              {send.data?.status === 'failed' && (
                <Notice tone="warning" title={t('page.failed')}>
                  {send.data.error ?? t('page.noReason')} {t('page.failedText')}
                </Notice>
              )}
            </div>
          ) : (
            <p className="text-[17px] text-ink-muted">{t('page.leadSends')}</p>
          )}
          <p className="text-[16px] text-ink-muted">
            {summary.data.caution === limitsCaution
              ? t('limitsCaution', { ns: 'words' })
              : summary.data.caution}
          </p>
        </>
      )}
    </div>
  );
}
