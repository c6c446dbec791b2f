import { systemWords } from '@shared/domain/words';
import { checkKindLabels } from '@shared/schemas/plain';
import { formatValue } from '@shared/domain/units';
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
  const query = useHold(holdId);
  if (query.isPending) return <p className="text-lead text-ink-muted">Loading the hold…</p>;
  if (query.isError)
    return (
      <Notice tone="warning" title="The hold did not load">
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
          {released ? 'Hold closed' : 'On hold'}
        </span>
        {channel === 'desk' && (
          <a
            className="ml-auto text-[20px] underline"
            href={`/api/holds/${hold.id}.pdf`}
            target="_blank"
            rel="noreferrer"
          >
            Printable record (PDF)
          </a>
        )}
      </header>
      <div className="text-[30px] font-semibold leading-tight text-warning-text">{hold.reason}</div>
      <p className="text-[22px]">
        {checkKindLabels[hold.check.kind]} signed by <strong>{hold.raisedBy.name}</strong> (badge{' '}
        {hold.check.signedBy.badgeNumber}) {recordTime(hold.check.signedAt)} · on hold since{' '}
        {recordTime(hold.openedAt)} · {hold.check.limitsVersion.typeCode} limits v
        {hold.check.limitsVersion.version}
      </p>

      {released && (
        <Notice
          tone="normal"
          big
          title={`Released by ${hold.releasedBy?.name ?? 'a shift lead'} at ${hold.releasedAt ? recordTime(hold.releasedAt) : ''}`}
        >
          The hold is closed by that certificate of release to service. The airframe's state now follows its
          other checks and defects; a pilot accepts it before flight.
        </Notice>
      )}

      <div className="grid gap-6 landscape:grid-cols-[minmax(0,1fr)_minmax(0,460px)]">
        <div className="flex min-w-0 flex-col gap-6">
          <section className="flex flex-col gap-3" aria-label="Readings against limits">
            <h2 className="flex items-center gap-4 text-[30px] font-bold">
              Readings against limits <VerdictBadge verdict={hold.check.verdict} />
            </h2>
            <ul className="flex flex-col gap-3">
              {[...notInLimits, ...inLimits].map((reading) => (
                <ReadingAgainstLimitsRow key={reading.code} reading={reading} />
              ))}
            </ul>
          </section>
          {hold.check.note && (
            <section className="flex flex-col gap-2">
              <h2 className="text-[28px] font-bold">Mechanic's note</h2>
              <p className="rounded-xl border-2 border-ink-line bg-ink-soft p-4 text-[24px]">
                {hold.check.note}
              </p>
            </section>
          )}
          <section className="flex flex-col gap-2">
            <h2 className="text-[28px] font-bold">Fluid added with this check</h2>
            {hold.check.servicing.length === 0 ? (
              <p className="text-[22px] text-ink-muted">None recorded.</p>
            ) : (
              <ul className="flex flex-col gap-2 text-[22px]">
                {hold.check.servicing.map((s) => (
                  <li key={s.code} className="rounded-xl border-2 border-ink-line bg-ink-soft p-3">
                    <strong>{formatValue(s.quantityL, 'L', 2)}</strong> {s.fluidSpec}, batch {s.batch} ·{' '}
                    {systemWords(s.system)}
                  </li>
                ))}
              </ul>
            )}
          </section>
        </div>

        <div className="flex min-w-0 flex-col gap-6">
          <section
            className="flex flex-col gap-3 rounded-2xl border-2 border-ink-line bg-ink-soft p-5"
            aria-label="Corrective action"
          >
            <h2 className="text-[32px] font-bold">Corrective action</h2>
            {hold.correctiveActions.length === 0 && (
              <p className="text-[22px] text-caution-text">None recorded yet.</p>
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
            <section className="flex flex-col gap-2" aria-label="Countersigns">
              <h2 className="text-[28px] font-bold">Countersigns</h2>
              <ul className="flex flex-col gap-2 text-[22px]">
                {hold.countersigns.map((c) => (
                  <li key={c.id} className="rounded-xl border-2 border-ink-line bg-ink-soft p-3">
                    <strong>{c.decision === 'release' ? 'Released' : 'Kept on hold'}</strong> by{' '}
                    {c.signedBy.name} · {recordTime(c.signedAt)} · with{' '}
                    {c.signedWith === 'pin' ? 'PIN' : 'password'}
                    {c.reason ? <div>{c.reason}</div> : null}
                  </li>
                ))}
              </ul>
            </section>
          )}

          {!released && (
            <>
              {ownCheck && canCountersign && (
                <Notice tone="caution" title="You signed this check">
                  Another shift lead countersigns it.
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
      <p className="text-[20px] text-ink-muted">{hold.caution}</p>
    </div>
  );
}
