import type { AirframeSummary } from '@shared/schemas/airframes';
import { checkKindLabels } from '@shared/schemas/plain';
import { VerdictBadge } from '@/components/ui/verdict-badge';

export function formatWhen(iso: string): string {
  const at = new Date(iso);
  const today = new Date().toDateString() === at.toDateString();
  const time = at.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
  return today ? `today ${time}` : `${at.toLocaleDateString([], { day: 'numeric', month: 'short' })} ${time}`;
}

export function LastCheckLine({ lastCheck }: { lastCheck: AirframeSummary['lastCheck'] }) {
  if (!lastCheck) return <p className="text-[22px] text-ink-muted">No check signed yet</p>;
  return (
    <div className="flex flex-wrap items-center gap-3 text-[22px]">
      <span>
        Last: <strong>{checkKindLabels[lastCheck.kind]}</strong> {formatWhen(lastCheck.signedAt)},{' '}
        {lastCheck.signedBy}
      </span>
      <VerdictBadge verdict={lastCheck.verdict} />
    </div>
  );
}
