import type { AirframeSummary } from '@shared/schemas/airframes';
import { DefectLines, defectsBesideHolds, findingReasons } from './defect-lines';
import { StateBadge } from './state-badge';

/** The top of an airframe tile on the kiosk: fleet number, state, type and base. */
export function AirframeHeading({ airframe }: { airframe: AirframeSummary }) {
  return (
    <>
      <div className="flex w-full flex-wrap items-start justify-between gap-2">
        <span className="tabular text-fleet font-bold">{airframe.fleetNumber}</span>
        <StateBadge state={airframe.state} causes={airframe.causes} />
      </div>
      <div className="text-[22px] text-ink-muted">
        {airframe.type.code} · {airframe.base.name}
      </div>
    </>
  );
}

/** Why an airframe is not simply serviceable: its holds, its findings and its defects. */
export function AirframeFindings({ airframe, now }: { airframe: AirframeSummary; now: number }) {
  return (
    <>
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
    </>
  );
}
