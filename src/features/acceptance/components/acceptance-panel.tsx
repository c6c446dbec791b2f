import { isPin } from '@shared/schemas/plain';
import { useEffect, useRef, useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { AcceptanceView } from '@shared/schemas/acceptance';
import { Button } from '@/components/ui/button';
import { PinEntry } from '@/components/ui/pin-entry';
import { Notice, RefusalNotices } from '@/components/ui/notice';
import { useAcceptAirframe } from '../api/accept-airframe';
import { localTime } from '@/lib/when';
import { phraseWords } from '@shared/i18n/phrase';

const refusalId = 'acceptance-refusal';

/** "Accept aircraft" signed with the pilot's PIN typed again; when it cannot be accepted, the reason instead. */
export function AcceptancePanel({ view }: { view: AcceptanceView }) {
  const accept = useAcceptAirframe(view.airframe.id);
  const { t } = useTranslation('acceptance');
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
        <Notice tone="normal" big title={t('accept.doneTitle', { at: localTime(accept.data.acceptedAt) })}>
          {t('accept.doneText', {
            fleetNumber: view.airframe.fleetNumber,
            name: accept.data.acceptedBy.name,
            count: accept.data.checkIds.length,
          })}
        </Notice>
      </div>
    );
  }
  if (!view.canAccept) {
    return (
      <div data-testid="acceptance-refused" className="flex flex-col gap-3">
        {/* Grey, not a faded green: a pilot in a hurry must not read it as a button to press. */}
        <Button tone="neutral" size="huge" className="w-full" disabled aria-describedby={refusalId}>
          {t('accept.button')}
        </Button>
        <div id={refusalId}>
          <Notice tone="warning" big title={t('accept.refusedTitle')}>
            {view.refusal ? phraseWords(view.refusal) : t('accept.refusedText')}
          </Notice>
        </div>
      </div>
    );
  }
  if (!entering) {
    return (
      <Button tone="go" size="huge" className="w-full" onClick={() => setEntering(true)}>
        {t('accept.button')}
      </Button>
    );
  }
  return (
    <section
      ref={panel}
      className="flex flex-col gap-4 rounded-2xl border-2 border-normal-edge bg-ink-soft p-5"
      aria-label={t('accept.button')}
    >
      <PinEntry
        label={
          <span className="text-[28px] font-bold">
            {t('accept.pinLabel', { fleetNumber: view.airframe.fleetNumber })}
          </span>
        }
        value={pin}
        onChange={setPin}
        testId="accept-pin"
        disabled={accept.isPending}
      />
      <RefusalNotices title={t('accept.failed')} failed={accept} />
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
          {t('cancel')}
        </Button>
        <Button
          tone="go"
          size="large"
          className="flex-1"
          disabled={!isPin(pin) || accept.isPending}
          onClick={() => accept.mutate(pin, { onSettled: () => setPin('') })}
        >
          {accept.isPending ? t('signing') : t('accept.sign')}
        </Button>
      </div>
    </section>
  );
}
