import { systemWords } from '@shared/domain/words';
import { useMemo, useState } from 'react';
import { checkKindLabels } from '@shared/schemas/plain';
import { errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { StateBadge } from '@/components/ui/state-badge';
import { useHandover, type ShiftWindow } from '../api/get-handover';
import { useSendHandover } from '../api/send-handover';
import { recordTime } from '@/lib/when';

const spans = [
  { hours: 12, label: 'Last 12 hours' },
  { hours: 24, label: 'Last 24 hours' },
  { hours: 24 * 7, label: 'Last 7 days' },
] as const;

const litres = (value: number) => `${value.toFixed(2)} L`;
const box = 'flex flex-col gap-3 rounded-2xl border-2 border-ink-line bg-ink-soft p-5';

/** The shift in one screen, and the same summary sent to maintenance control. */
export function HandoverPage({ canSend }: { canSend: boolean }) {
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
            {span.label}
          </Button>
        ))}
        <span className="text-[17px] text-ink-muted">
          {recordTime(shift.from)} to {recordTime(shift.to)}
        </span>
      </div>

      {summary.isPending && <p className="text-[17px] text-ink-muted">Adding up the shift…</p>}
      {summary.isError && (
        <Notice tone="warning" title="The summary did not load">
          {errorMessage(summary.error)}
        </Notice>
      )}
      {summary.data && (
        <>
          <section className={box} aria-label="Airframes now" data-testid="handover-states">
            <h2 className="text-[16px] font-bold">Airframes now</h2>
            <ul className="flex flex-wrap gap-3">
              {summary.data.states.map((s) => (
                <li key={s.airframe.id} className="flex items-center gap-3 text-[18px] font-semibold">
                  <span className="tabular">{s.airframe.fleetNumber}</span>
                  <StateBadge state={s.state} causes={s.causes} />
                </li>
              ))}
            </ul>
            <h3 className="text-[18px] font-bold">Defects open or deferred</h3>
            {summary.data.defects.length === 0 ? (
              <p className="text-[17px] text-ink-muted">None.</p>
            ) : (
              <ul className="flex flex-col gap-1 text-[17px]">
                {summary.data.defects.flatMap((a) =>
                  a.defects.map((d) => (
                    <li key={d.id}>
                      <strong>{a.airframe.fleetNumber}</strong> defect {d.number}: {d.description} ({d.reason}
                      )
                    </li>
                  )),
                )}
              </ul>
            )}
          </section>
          <div className="grid gap-5 landscape:grid-cols-3" data-testid="handover-summary">
            <section className={box}>
              <h2 className="text-[16px] font-bold">Checks: {summary.data.checks.total}</h2>
              <table className="text-[17px]">
                <thead className="text-left text-ink-muted">
                  <tr>
                    <th className="pr-3 font-semibold">Kind</th>
                    <th className="pr-3 font-semibold">In limits</th>
                    <th className="pr-3 font-semibold">Service</th>
                    <th className="font-semibold">Out</th>
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
              <h2 className="text-[16px] font-bold">Holds</h2>
              <div className="text-[18px]">
                Opened <strong>{summary.data.holdsOpened.length}</strong> · released{' '}
                <strong>{summary.data.holdsReleased.length}</strong> · still open{' '}
                <strong className={summary.data.holdsStillOpen > 0 ? 'text-warning-text' : ''}>
                  {summary.data.holdsStillOpen}
                </strong>
              </div>
              <ul className="flex flex-col gap-1 text-[17px]">
                {summary.data.holdsOpened.map((h) => (
                  <li key={`o${h.id}`}>
                    <strong>{h.airframe.fleetNumber}</strong> held {recordTime(h.openedAt)}: {h.reason}
                  </li>
                ))}
                {summary.data.holdsReleased.map((h) => (
                  <li key={`r${h.id}`}>
                    <strong>{h.airframe.fleetNumber}</strong> released {recordTime(h.releasedAt)} by{' '}
                    {h.releasedBy}
                  </li>
                ))}
              </ul>
            </section>
            <section className={box}>
              <h2 className="text-[16px] font-bold">Fluid used</h2>
              {summary.data.fluidUsed.bySystem.length === 0 && (
                <p className="text-[17px] text-ink-muted">No fluid added.</p>
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
            <Notice tone="caution" title="Consumption alerts">
              <ul className="flex flex-col gap-1">
                {summary.data.consumptionAlerts.map((alert) => (
                  <li key={alert}>{alert}</li>
                ))}
              </ul>
            </Notice>
          )}
          {summary.data.notes.length > 0 && (
            <Notice tone="info" title="Notes">
              <ul className="flex flex-col gap-1">
                {summary.data.notes.map((note) => (
                  <li key={note}>{note}</li>
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
                {send.isPending ? 'Sending…' : 'Send by e-mail'}
              </Button>
              {send.isError && (
                <Notice tone="warning" title="Not sent">
                  {errorMessage(send.error)}
                </Notice>
              )}
              {send.data?.status === 'sent' && (
                <Notice tone="normal" title={`Sent to ${send.data.to.join(', ')}`}>
                  {send.data.subject}
                </Notice>
              )}
              {send.data?.status === 'failed' && (
                <Notice tone="warning" title="The mail server did not take it">
                  {send.data.error ?? 'No reason given.'} It is recorded as failed; try again.
                </Notice>
              )}
            </div>
          ) : (
            <p className="text-[17px] text-ink-muted">A shift lead sends the handover.</p>
          )}
          <p className="text-[16px] text-ink-muted">{summary.data.caution}</p>
        </>
      )}
    </div>
  );
}
