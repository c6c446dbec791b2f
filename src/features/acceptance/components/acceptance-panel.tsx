import { isPin } from '@shared/schemas/plain';
import { useEffect, useRef, useState } from 'react';
import type { AcceptanceView } from '@shared/schemas/acceptance';
import { Button } from '@/components/ui/button';
import { PinEntry } from '@/components/ui/pin-entry';
import { Notice, RefusalNotices } from '@/components/ui/notice';
import { useAcceptAirframe } from '../api/accept-airframe';
import { localTime } from '@/lib/when';

/** "Accept aircraft" signed with the pilot's PIN typed again; when it cannot be accepted, the reason instead. */
export function AcceptancePanel({ view }: { view: AcceptanceView }) {
  const accept = useAcceptAirframe(view.airframe.id);
  const [entering, setEntering] = useState(false);
  const [pin, setPin] = useState('');
  const panel = useRef<HTMLElement>(null);
  // On a landscape tablet the keypad and its Sign button would start below the fold.
  useEffect(() => {
    if (entering) panel.current?.scrollIntoView({ block: 'start' });
  }, [entering]);

  if (accept.isSuccess) {
    return (
      <div data-testid="acceptance-done">
        <Notice tone="normal" big title={`Accepted ${localTime(accept.data.acceptedAt)}`}>
          {view.airframe.fleetNumber} accepted by {accept.data.acceptedBy.name}, resting on{' '}
          {accept.data.checkIds.length} signed check
          {accept.data.checkIds.length === 1 ? '' : 's'}. The hangar board shows it.
        </Notice>
      </div>
    );
  }
  if (!view.canAccept) {
    return (
      <div data-testid="acceptance-refused" className="flex flex-col gap-3">
        {/* Grey, not a faded green: a pilot in a hurry must not read it as a button to press. */}
        <Button tone="neutral" size="huge" className="w-full" disabled aria-describedby="acceptance-refusal">
          Accept aircraft
        </Button>
        <div id="acceptance-refusal">
          <Notice tone="warning" big title="Cannot be accepted">
            {view.refusal ?? 'The aircraft cannot be accepted now.'}
          </Notice>
        </div>
      </div>
    );
  }
  if (!entering) {
    return (
      <Button tone="go" size="huge" className="w-full" onClick={() => setEntering(true)}>
        Accept aircraft
      </Button>
    );
  }
  return (
    <section
      ref={panel}
      className="flex flex-col gap-4 rounded-2xl border-2 border-normal-edge bg-ink-soft p-5"
      aria-label="Accept aircraft"
    >
      <PinEntry
        label={
          <span className="text-[28px] font-bold">Accept {view.airframe.fleetNumber}: type your PIN</span>
        }
        value={pin}
        onChange={setPin}
        testId="accept-pin"
        disabled={accept.isPending}
      />
      <RefusalNotices title="Not accepted" failed={accept} />
      <div className="flex gap-3">
        <Button
          tone="neutral"
          size="large"
          onClick={() => {
            setEntering(false);
            setPin('');
            accept.reset();
          }}
        >
          Cancel
        </Button>
        <Button
          tone="go"
          size="large"
          className="flex-1"
          disabled={!isPin(pin) || accept.isPending}
          onClick={() => accept.mutate(pin, { onSettled: () => setPin('') })}
        >
          {accept.isPending ? 'Signing…' : 'Sign acceptance'}
        </Button>
      </div>
    </section>
  );
}
