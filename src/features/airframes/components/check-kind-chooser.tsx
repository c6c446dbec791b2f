import type { CheckKind } from '../../../../shared/schemas/limits';
import type { AirframeSummary } from '../../../../shared/schemas/api';
import { checkKindLabels } from '../../../../shared/schemas/plain';
import { Button } from '../../../components/ui/button';
import { StateBadge } from '../../../components/ui/state-badge';
import { Notice } from '../../../components/ui/notice';

const otherKinds: CheckKind[] = ['ground_run', 'after_flight', 'servicing'];

/** What to do with the airframe in hand; pre-flight is the morning's job, so it is the big one. */
export function CheckKindChooser({
  airframe,
  onStart,
}: {
  airframe: AirframeSummary;
  onStart: (kind: CheckKind) => void;
}) {
  return (
    <section
      aria-label={`Start a check on ${airframe.fleetNumber}`}
      className="flex flex-col gap-4 rounded-xl border-2 border-signal-bright bg-ink-soft p-5"
    >
      <div className="flex flex-wrap items-center gap-4">
        <h2 className="tabular text-fleet font-bold">{airframe.fleetNumber}</h2>
        <div className="text-[24px] text-ink-muted">{airframe.type.name}</div>
        <StateBadge state={airframe.state} size="lg" />
      </div>
      {airframe.openHolds.length > 0 && (
        <Notice tone="warning" title="On hold">
          {airframe.openHolds.map((hold) => hold.reason).join('; ')}. Do not release; a shift lead decides.
        </Notice>
      )}
      <Button tone="primary" size="huge" onClick={() => onStart('pre_flight')} data-testid="start-pre_flight">
        Start {checkKindLabels.pre_flight} check
      </Button>
      <div className="grid grid-cols-3 gap-3 portrait:grid-cols-1">
        {otherKinds.map((kind) => (
          <Button
            key={kind}
            tone="neutral"
            size="large"
            onClick={() => onStart(kind)}
            data-testid={`start-${kind}`}
          >
            {checkKindLabels[kind]}
          </Button>
        ))}
      </div>
    </section>
  );
}
