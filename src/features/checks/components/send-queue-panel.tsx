import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ShapeIcon, type Shape } from '@/components/ui/shapes';
import {
  providePin,
  secondsToNextTry,
  wakeQueue,
  type QueuedCheck,
  type QueueItemState,
} from '../model/send-queue';
import { useSendQueue } from '../model/use-send-queue';
import { useNow } from '@/lib/use-now';
import { PinSigningScreen } from '@/components/ui/pin-entry';
import { localTime } from '@/lib/when';
import { useCheckWords } from '../model/check-words';

interface SignedIn {
  kioskId: number;
  badge: string;
}

const stateLook = {
  sending: { shape: 'half', tone: 'border-signal-edge text-signal-text', word: 'queue.sending' },
  waiting: { shape: 'clock', tone: 'border-caution-edge text-caution-text', word: 'queue.waiting' },
  needs_pin: { shape: 'triangle', tone: 'border-caution-edge text-caution-text', word: 'queue.needsPin' },
  refused: { shape: 'octagon', tone: 'border-warning-edge text-warning-text', word: 'queue.refused' },
} as const satisfies Record<QueueItemState, { shape: Shape; tone: string; word: string }>;

export interface SendQueuePanelProps {
  /** Who is signed in; null on the sign-in screen (nothing is sent there). */
  signedIn: SignedIn | null;
  onReview?: (item: QueuedCheck) => void;
  onOpenResult?: (checkId: string) => void;
  /** Show the checks sent from the queue since the page loaded. */
  showSent?: boolean;
}

/** Every signed check still on the tablet, with its airframe and state, and what the mechanic can do about it. */
export function SendQueuePanel({ signedIn, onReview, onOpenResult, showSent = true }: SendQueuePanelProps) {
  const { t, words } = useCheckWords();
  const queue = useSendQueue();
  const now = useNow();
  const [pinFor, setPinFor] = useState<QueuedCheck | null>(null);
  const sent = showSent && signedIn ? queue.sent.filter((check) => check.badge === signedIn.badge) : [];
  if (queue.items.length === 0 && sent.length === 0) return null;
  const mine = (item: QueuedCheck) =>
    signedIn !== null && item.owner.kioskId === signedIn.kioskId && item.owner.badge === signedIn.badge;

  return (
    <section
      aria-label={t('queue.label')}
      data-testid="send-queue"
      className="flex flex-col gap-3 rounded-xl border-2 border-caution-edge bg-ink-soft p-4"
    >
      {queue.items.length > 0 && (
        <>
          <h2 className="text-[30px] font-bold">{t('queue.button', { number: queue.items.length })}</h2>
          <p className="text-[22px]">{t('queue.intro')}</p>
        </>
      )}
      <ul className="flex flex-col gap-3">
        {queue.items.map((item) => {
          const state = queue.stateOf(item);
          const look = stateLook[state];
          const owned = mine(item);
          return (
            <li
              key={item.id}
              data-testid="queue-item"
              data-state={state}
              className={`flex flex-wrap items-center gap-4 rounded-xl border-2 border-l-8 bg-ink p-3 ${look.tone}`}
            >
              <ShapeIcon shape={look.shape} size={40} />
              <div className="min-w-[260px] flex-1 text-paper">
                <div className="text-[26px] font-bold">
                  <span className="tabular">{item.fleetNumber}</span> {words.kind(item.kind)} ·{' '}
                  <span className={look.tone.split(' ')[1]}>{t(look.word)}</span>
                </div>
                <div className="text-[22px] text-ink-muted">
                  {t('queue.signedBy', {
                    name: item.owner.name,
                    badge: item.owner.badge,
                    time: localTime(item.queuedAt),
                  })}
                </div>
                {state === 'waiting' && (
                  <div className="text-[22px]">
                    {item.lastProblem} {t('queue.nextTry', { seconds: secondsToNextTry(item, now) })}
                  </div>
                )}
                {state === 'needs_pin' &&
                  (owned ? (
                    <div className="text-[22px]">
                      {item.pinRefused ?? t('queue.pinForgotten')} {t('queue.enterPinToSend')}
                    </div>
                  ) : (
                    <div className="text-[22px]">{t('queue.sentWhen', { name: item.owner.name })}</div>
                  ))}
                {state === 'refused' && item.refused && (
                  <div className="text-[22px] font-semibold text-warning-text" data-testid="queue-refused">
                    {t('queue.refusedBy', { message: item.refused.message })}{' '}
                    {owned ? t('queue.reviewYours') : t('queue.reviewTheirs', { name: item.owner.name })}
                  </div>
                )}
              </div>
              {state === 'waiting' && owned && (
                <Button tone="neutral" onClick={wakeQueue}>
                  {t('queue.sendNow')}
                </Button>
              )}
              {state === 'needs_pin' && owned && (
                <Button tone="primary" onClick={() => setPinFor(item)}>
                  {t('queue.enterPin')}
                </Button>
              )}
              {state === 'refused' && owned && onReview && (
                <Button tone="primary" onClick={() => onReview(item)}>
                  {t('queue.openForReview')}
                </Button>
              )}
            </li>
          );
        })}
        {sent.map((check) => (
          <li
            key={check.id}
            data-testid="queue-sent"
            className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-l-8 border-normal-edge bg-ink p-3"
          >
            <ShapeIcon shape="circle-check" size={40} className="text-normal-edge" />
            <div className="min-w-[260px] flex-1 text-[26px] font-bold">
              <span className="tabular">{check.fleetNumber}</span> {words.kind(check.kind)} ·{' '}
              <span className="text-normal-text">{t('queue.sent')}</span>
            </div>
            {onOpenResult && (
              <Button tone="neutral" onClick={() => onOpenResult(check.id)}>
                {t('queue.seeResult')}
              </Button>
            )}
          </li>
        ))}
      </ul>
      {pinFor && <QueuePinDialog item={pinFor} onClose={() => setPinFor(null)} />}
    </section>
  );
}

function QueuePinDialog({ item, onClose }: { item: QueuedCheck; onClose: () => void }) {
  const { t, words } = useCheckWords();
  return (
    <div
      role="dialog"
      aria-modal="true"
      aria-label={t('queue.dialogLabel', { fleet: item.fleetNumber })}
      className="fixed inset-0 z-50 grid gap-6 overflow-auto bg-ink p-6 landscape:grid-cols-[1fr_420px]"
    >
      <PinSigningScreen
        title={t('queue.dialogTitle', { fleet: item.fleetNumber, check: words.kindCheck(item.kind) })}
        testId="queue-pin-dots"
        backLabel={t('nav.cancel')}
        onBack={onClose}
        signLabel={t('queue.signAndSend')}
        onSign={(pin) => {
          void providePin(item.id, pin);
          onClose();
        }}
      >
        {t('queue.dialogBody', { name: item.owner.name })}
      </PinSigningScreen>
    </div>
  );
}
