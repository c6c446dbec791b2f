import type { AirframeSummary } from '../../../../shared/schemas/api';
import { checkKindLabels } from '../../../../shared/schemas/plain';
import { StateBadge } from '../../../components/ui/state-badge';
import { VerdictBadge } from '../../../components/ui/verdict-badge';

export type BoardTheme = 'dark' | 'light';

const edge: Record<AirframeSummary['state'], string> = {
  released: 'border-t-normal-bright',
  due: 'border-t-caution-bright',
  in_progress: 'border-t-signal-bright',
  hold: 'border-t-warning-bright',
  not_checked: 'border-t-ink-line',
};

function clock(iso: string): string {
  return new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
}

export function countdown(iso: string, now: number): { text: string; overdue: boolean } {
  const minutes = Math.round((new Date(iso).getTime() - now) / 60_000);
  const overdue = minutes < 0;
  const total = Math.abs(minutes);
  const span =
    total >= 60 ? `${Math.floor(total / 60)} h ${String(total % 60).padStart(2, '0')} min` : `${total} min`;
  return { text: overdue ? `overdue by ${span}` : `due in ${span}`, overdue };
}

export function BoardTile({
  airframe,
  theme,
  now,
}: {
  airframe: AirframeSummary;
  theme: BoardTheme;
  now: number;
}) {
  const dark = theme === 'dark';
  const muted = dark ? 'text-ink-muted' : 'text-paper-muted';
  const due = airframe.nextDue ? countdown(airframe.nextDue.at, now) : null;
  return (
    <article
      data-testid={`board-${airframe.fleetNumber}`}
      data-state={airframe.state}
      className={`flex min-w-0 flex-col gap-2 overflow-hidden rounded-2xl border-2 border-t-[14px] p-4 ${edge[airframe.state]} ${dark ? 'border-ink-line bg-ink-soft text-paper' : 'border-paper-line bg-paper-card text-ink'}`}
    >
      <header className="flex flex-wrap items-center justify-between gap-x-3 gap-y-2">
        <h2 className="tabular text-[88px] font-bold leading-[0.9]">{airframe.fleetNumber}</h2>
        <StateBadge state={airframe.state} size="lg" />
      </header>
      {airframe.openHolds.length > 0 && (
        <ul
          className={`flex flex-col gap-1 rounded-lg p-3 text-[28px] font-semibold leading-snug ${dark ? 'bg-ink text-warning-text' : 'bg-warning-tint text-warning'}`}
          aria-label="Open holds"
        >
          {airframe.openHolds.map((hold) => (
            // Two lines read from across the hangar; the lead desk has the whole reason.
            <li key={hold.id} className="line-clamp-2" title={hold.reason}>
              Hold: {hold.reason}
            </li>
          ))}
        </ul>
      )}
      {airframe.openHolds.length === 0 && (
        <div className={`text-[26px] ${muted}`}>
          {airframe.type.code} · {airframe.base.name}
        </div>
      )}
      <div className="text-[26px] leading-snug">
        {airframe.lastCheck ? (
          <div className="flex flex-wrap items-center gap-3">
            <span>
              <strong>{checkKindLabels[airframe.lastCheck.kind]}</strong> {clock(airframe.lastCheck.signedAt)}{' '}
              · {airframe.lastCheck.signedBy}
            </span>
            <VerdictBadge verdict={airframe.lastCheck.verdict} />
          </div>
        ) : (
          <span className={muted}>No check signed</span>
        )}
      </div>
      {airframe.lastAcceptance && (
        <div
          data-testid="board-acceptance"
          className={`text-[26px] font-semibold ${dark ? 'text-normal-text' : 'text-normal'}`}
        >
          Accepted by {airframe.lastAcceptance.by} {clock(airframe.lastAcceptance.at)}
        </div>
      )}
      {airframe.nextDue && due && (
        <div
          className={`text-[28px] font-semibold ${due.overdue ? (dark ? 'text-caution-text' : 'text-caution') : ''}`}
        >
          {checkKindLabels[airframe.nextDue.kind]} {due.text}
        </div>
      )}
    </article>
  );
}
