import { useTranslation } from 'react-i18next';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { AirframeFindings, AirframeHeading } from '@/components/ui/airframe-lines';
import { stateEdgeLeft } from '@/components/ui/state-badge';
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
  const { t } = useTranslation('airframes');
  return (
    <button
      type="button"
      data-testid={`airframe-${airframe.fleetNumber}`}
      aria-label={t('tile.label', { fleetNumber: airframe.fleetNumber, typeCode: airframe.type.code })}
      aria-pressed={selected}
      onClick={onOpen}
      className={`flex min-h-[180px] flex-col gap-2 rounded-xl border-2 border-l-[12px] bg-ink-soft p-4 text-left active:scale-[0.99] ${stateEdgeLeft[airframe.state]} ${selected ? 'border-signal-edge ring-4 ring-signal-edge' : 'border-ink-line'}`}
    >
      <AirframeHeading airframe={airframe} />
      <LastCheckLine lastCheck={airframe.lastCheck} />
      <AirframeFindings airframe={airframe} now={now} />
    </button>
  );
}
