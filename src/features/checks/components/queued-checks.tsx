import { lazy, Suspense } from 'react';
import { useTranslation } from 'react-i18next';
import { Button } from '@/components/ui/button';
import { ShapeIcon } from '@/components/ui/shapes';
import { sharedWordsLoaded } from '@/i18n/i18n';
import { useSendQueue } from '../model/use-send-queue';
import type { SendQueuePanelProps } from './send-queue-panel';

// What the kiosk's first screens (sign-in, every header) show of the send queue, kept small: the panel and the
// checks catalogue it reads load only when a signed check is waiting on this tablet, so an empty queue costs the
// first screen nothing. The service worker precaches both, so a tablet offline still opens its queue.

const SendQueuePanel = lazy(() =>
  Promise.all([import('./send-queue-panel'), sharedWordsLoaded()]).then(([module]) => ({
    default: module.SendQueuePanel,
  })),
);

/** The send queue panel when the tablet holds a queued or just-sent check; nothing otherwise. */
export function QueuedChecks(props: SendQueuePanelProps) {
  const queue = useSendQueue();
  // The same rule the panel applies, so its code loads only when it has something to show.
  const { signedIn, showSent = true } = props;
  const sentHere =
    showSent && signedIn !== null && queue.sent.some((check) => check.badge === signedIn.badge);
  if (queue.items.length === 0 && !sentHere) return null;
  return (
    <Suspense fallback={null}>
      <SendQueuePanel {...props} />
    </Suspense>
  );
}

/** "Waiting to send (n)" for the header of every kiosk screen; nothing when the queue is empty. */
export function WaitingToSendButton({ onOpen }: { onOpen: () => void }) {
  const queue = useSendQueue();
  if (queue.items.length === 0) return null;
  return (
    <WaitingButton
      count={queue.items.length}
      refused={queue.items.some((item) => item.refused)}
      onOpen={onOpen}
    />
  );
}

function WaitingButton({ count, refused, onOpen }: { count: number; refused: boolean; onOpen: () => void }) {
  // Never waits for the checks catalogue: the header shows the button once its words are there.
  const { t, ready } = useTranslation('checks', { useSuspense: false });
  if (!ready) return null;
  return (
    <Button
      tone={refused ? 'stop' : 'neutral'}
      onClick={onOpen}
      data-testid="waiting-to-send"
      className="border-caution-edge"
    >
      <ShapeIcon
        shape={refused ? 'octagon' : 'clock'}
        size={30}
        className={refused ? 'text-white' : 'text-caution-edge'}
      />
      {t('queue.button', { number: count })}
    </Button>
  );
}
