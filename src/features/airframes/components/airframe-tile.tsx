import type { AirframeSummary } from '@shared/schemas/airframes';
import { DefectLines, defectsBesideHolds, findingReasons } from '@/components/ui/defect-lines';
import { StateBadge, stateEdgeLeft } from '@/components/ui/state-badge';
import { LastCheckLine } from './last-check-line';

/** One airframe on the kiosk list; the whole tile is the button. */
export function AirframeTile({
  airframe,
  selected,
  onOpen,
  now,
}: {
  airframe: AirframeSummary;
  selected: boolean;
  onOpen: () => void;
  now: number;
}) {
  return (
    <button
      type="button"
      data-testid={`airframe-${airframe.fleetNumber}`}
      aria-label={`Airframe ${airframe.fleetNumber}, ${airframe.type.code}`}
      aria-pressed={selected}
      onClick={onOpen}
      className={`flex min-h-[180px] flex-col gap-2 rounded-xl border-2 border-l-[12px] bg-ink-soft p-4 text-left active:scale-[0.99] ${stateEdgeLeft[airframe.state]} ${selected ? 'border-signal-bright ring-4 ring-signal-bright' : 'border-ink-line'}`}
    >
      <div className="flex w-full flex-wrap items-start justify-between gap-2">
        <span className="tabular text-fleet font-bold">{airframe.fleetNumber}</span>
        <StateBadge state={airframe.state} causes={airframe.causes} />
      </div>
      <div className="text-[22px] text-ink-muted">
        {airframe.type.code} · {airframe.base.name}
      </div>
      <LastCheckLine lastCheck={airframe.lastCheck} />
      {airframe.openHolds.length > 0 && (
        <div className="text-[22px] font-semibold text-warning-text">
          Hold: {airframe.openHolds.map((hold) => hold.reason).join('; ')}
        </div>
      )}
      {findingReasons(airframe).map((reason) => (
        <div key={reason} className="text-[22px] font-semibold text-warning-text">
          {reason}
        </div>
      ))}
      <DefectLines defects={defectsBesideHolds(airframe)} now={now} />
    </button>
  );
}
