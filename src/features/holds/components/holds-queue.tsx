import { Link } from 'react-router-dom';
import { checkKindLabels } from '@shared/schemas/plain';
import { errorMessage } from '@/lib/api-client';
import { Notice } from '@/components/ui/notice';
import { ShapeIcon } from '@/components/ui/shapes';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { recordTime } from '@/lib/when';
import { useHolds } from '../api/get-holds';

/** Every open hold, oldest first, readable from across the desk: fleet number, why, who found it, whether a re-check passed. */
export function HoldsQueue({ hrefFor }: { hrefFor: (holdId: number) => string }) {
  const holds = useHolds();
  if (holds.isPending) return <p className="text-lead text-ink-muted">Loading the holds…</p>;
  if (holds.isError)
    return (
      <Notice tone="warning" title="The holds did not load">
        {errorMessage(holds.error)}
      </Notice>
    );
  if (holds.data.length === 0)
    return (
      <Notice tone="normal" big title="No open holds">
        Every airframe that was held has been released.
      </Notice>
    );
  return (
    <ol className="flex flex-col gap-4" aria-label="Open holds, oldest first">
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
              <div className="text-[28px] font-semibold leading-tight text-warning-text">{hold.reason}</div>
              <div className="text-[22px]">
                Found by <strong>{hold.check.signedBy.name}</strong> · {checkKindLabels[hold.check.kind]}{' '}
                signed {recordTime(hold.check.signedAt)} · on hold since {recordTime(hold.openedAt)}
              </div>
              {hold.findings.map((finding) => (
                <div key={finding.code} className="flex flex-wrap items-center gap-3 text-[22px]">
                  <VerdictBadge verdict={finding.verdict} />
                  <span>
                    {finding.label}:{' '}
                    <strong className="tabular">
                      {finding.value ?? '—'} {finding.unit ?? ''}
                    </strong>
                    {finding.limitText ? ` (limit: ${finding.limitText})` : ''}
                  </span>
                </div>
              ))}
              <div className="flex flex-wrap gap-3 text-[22px] font-semibold">
                {hold.recheckPassed ? (
                  <span
                    className="inline-flex items-center gap-2 text-normal-text"
                    data-testid="recheck-passed"
                  >
                    <ShapeIcon shape="circle-check" size={28} /> Re-check passed
                  </span>
                ) : (
                  <span
                    className="inline-flex items-center gap-2 text-caution-text"
                    data-testid="recheck-missing"
                  >
                    <ShapeIcon shape="triangle" size={28} /> No passing re-check yet
                  </span>
                )}
                <span className="text-ink-muted">
                  ·{' '}
                  {hold.correctiveActionCount === 0
                    ? 'no corrective action yet'
                    : `${hold.correctiveActionCount} corrective action${hold.correctiveActionCount > 1 ? 's' : ''}`}
                </span>
                {hold.lastCountersign?.decision === 'keep' && (
                  <span className="text-ink-muted">
                    · kept by {hold.lastCountersign.by}: {hold.lastCountersign.reason}
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
