import { useState } from 'react';
import { useTranslation } from 'react-i18next';
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
const stages = { idle: 'idle', figures: 'figures', pin: 'pin' } as const satisfies Record<Stage, Stage>;

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
  const { t } = useTranslation('acceptance');

  if (stage === 'idle') {
    return (
      <div className="flex flex-col gap-3">
        {close.isSuccess && (
          <div data-testid="flight-closed">
            <Notice
              tone="normal"
              title={t('flightClose.doneTitle', { at: localTime(close.data.recordedAt) })}
            >
              {t('flightClose.doneText', {
                fleetNumber: view.airframe.fleetNumber,
                figures: figuresWords(close.data.figures),
              })}
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
            setStage(stages.figures);
          }}
        >
          {t('flightClose.button')}
        </Button>
      </div>
    );
  }
  const cancel = () => {
    setStage(stages.idle);
    setPin('');
    close.reset();
  };
  return (
    <section
      className="flex flex-col gap-4 rounded-2xl border-2 border-signal-edge bg-ink-soft p-5"
      aria-label={t('flightClose.button')}
    >
      <h2 className="text-[28px] font-bold">
        {t('flightClose.title', { fleetNumber: view.airframe.fleetNumber })}
      </h2>
      {stage === 'figures' ? (
        <>
          <p className="text-[22px] text-ink-muted">
            {t('flightClose.enterNow', { last: lastUsageWords(view.lastUsage) })}
          </p>
          <UsageEntry last={view.lastUsage} value={figures} onChange={setFigures} stacked />
        </>
      ) : (
        <PinEntry
          label={
            <span className="text-[24px] font-bold">
              {t('flightClose.pinLabel', { figures: figuresWords(figures) })}
            </span>
          }
          value={pin}
          onChange={setPin}
          testId="flight-close-pin"
          disabled={close.isPending}
        />
      )}
      <RefusalNotices title={t('flightClose.failed')} failed={close} />
      <div className="flex gap-3">
        <Button
          tone="neutral"
          size="large"
          onClick={stage === 'pin' ? () => setStage(stages.figures) : cancel}
        >
          {stage === 'pin' ? t('back') : t('cancel')}
        </Button>
        {stage === 'figures' ? (
          <Button tone="primary" size="large" className="flex-1" onClick={() => setStage(stages.pin)}>
            {t('next')}
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
                  onSuccess: () => setStage(stages.idle),
                  // Back to the figures with the refusal shown: nothing typed is lost.
                  onError: () => setStage(stages.figures),
                },
              )
            }
          >
            {close.isPending ? t('signing') : t('flightClose.sign')}
          </Button>
        )}
      </div>
    </section>
  );
}
