import { useState } from 'react';
import type { AcceptanceView } from '@shared/schemas/acceptance';
import type { UsageFigures } from '@shared/schemas/usage';
import { formatFigure } from '@shared/domain/usage';
import { isPin } from '@shared/schemas/plain';
import { Button } from '@/components/ui/button';
import { Notice, RefusalNotices } from '@/components/ui/notice';
import { PinEntry } from '@/components/ui/pin-entry';
import { lastUsageWords, UsageEntry } from '@/components/ui/usage-entry';
import { localTime } from '@/lib/when';
import { useCloseFlight } from '../api/close-flight';

type Stage = 'idle' | 'figures' | 'pin';

const figuresWords = (f: UsageFigures) =>
  `${formatFigure('hours', f.hours)}, ${formatFigure('flights', f.flights)}, ${formatFigure('landings', f.landings)}`;

/**
 * The pilot's close of a flight: the airframe's hours, flights and landings after it, then the PIN typed again as
 * the signature. A refusal (a figure behind the last one, or too far ahead) keeps the figures typed, to correct.
 */
export function FlightClosePanel({ view }: { view: AcceptanceView }) {
  const close = useCloseFlight(view.airframe.id);
  const [stage, setStage] = useState<Stage>('idle');
  const [figures, setFigures] = useState<UsageFigures>(view.lastUsage);
  const [pin, setPin] = useState('');

  if (stage === 'idle') {
    return (
      <div className="flex flex-col gap-3">
        {close.isSuccess && (
          <div data-testid="flight-closed">
            <Notice tone="normal" title={`Flight closed ${localTime(close.data.recordedAt)}`}>
              {view.airframe.fleetNumber} now stands at {figuresWords(close.data.figures)}.
            </Notice>
          </div>
        )}
        <Button
          tone="neutral"
          size="large"
          className="w-full"
          onClick={() => {
            close.reset();
            setFigures(view.lastUsage);
            setStage('figures');
          }}
        >
          Close a flight
        </Button>
      </div>
    );
  }
  const cancel = () => {
    setStage('idle');
    setPin('');
    close.reset();
  };
  return (
    <section
      className="flex flex-col gap-4 rounded-2xl border-2 border-signal-edge bg-ink-soft p-5"
      aria-label="Close a flight"
    >
      <h2 className="text-[28px] font-bold">Close a flight on {view.airframe.fleetNumber}</h2>
      {stage === 'figures' ? (
        <>
          <p className="text-[22px] text-ink-muted">
            Enter what the aircraft shows now. {lastUsageWords(view.lastUsage)}
          </p>
          <UsageEntry last={view.lastUsage} value={figures} onChange={setFigures} stacked />
        </>
      ) : (
        <PinEntry
          label={<span className="text-[24px] font-bold">Sign {figuresWords(figures)}: type your PIN</span>}
          value={pin}
          onChange={setPin}
          testId="flight-close-pin"
          disabled={close.isPending}
        />
      )}
      <RefusalNotices title="Flight not closed" failed={close} />
      <div className="flex gap-3">
        <Button tone="neutral" size="large" onClick={stage === 'pin' ? () => setStage('figures') : cancel}>
          {stage === 'pin' ? 'Back' : 'Cancel'}
        </Button>
        {stage === 'figures' ? (
          <Button tone="primary" size="large" className="flex-1" onClick={() => setStage('pin')}>
            Next
          </Button>
        ) : (
          <Button
            tone="go"
            size="large"
            className="flex-1"
            disabled={!isPin(pin) || close.isPending}
            onClick={() =>
              close.mutate(
                { usage: figures, pin },
                {
                  onSettled: () => setPin(''),
                  onSuccess: () => setStage('idle'),
                  // Back to the figures with the refusal shown: nothing typed is lost.
                  onError: () => setStage('figures'),
                },
              )
            }
          >
            {close.isPending ? 'Signing…' : 'Sign flight close'}
          </Button>
        )}
      </div>
    </section>
  );
}
