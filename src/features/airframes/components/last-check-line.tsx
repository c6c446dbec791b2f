import type { AirframeSummary } from '@shared/schemas/airframes';
import { checkKindLabels } from '@shared/schemas/plain';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { localTime } from '@/lib/when';

export function LastCheckLine({ lastCheck }: { lastCheck: AirframeSummary['lastCheck'] }) {
  if (!lastCheck) return <p className="text-[22px] text-ink-muted">No check signed yet</p>;
  return (
    <div className="flex flex-wrap items-center gap-3 text-[22px]">
      <span>
        Last: <strong>{checkKindLabels[lastCheck.kind]}</strong> {localTime(lastCheck.signedAt)},{' '}
        {lastCheck.signedBy}
      </span>
      <VerdictBadge verdict={lastCheck.verdict} />
    </div>
  );
}
