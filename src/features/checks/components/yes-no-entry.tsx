import { useEffect, useState } from 'react';
import type { ReadingEntry } from '@shared/schemas/limits';
import { useTranslation } from 'react-i18next';

interface YesNoEntryProps {
  entry: ReadingEntry | undefined;
  onAnswer: (answer: boolean) => void;
}

// The next question appears under the same finger; a short pause stops a glove's double tap answering it too.
const armDelayMs = 350;

/** Whether a one-tap answer may be taken yet, and how to disarm it after a tap until the pause has passed. */
export function useArmed(): [boolean, () => void] {
  const [armed, setArmed] = useState(false);
  useEffect(() => {
    if (armed) return;
    const timer = window.setTimeout(() => setArmed(true), armDelayMs);
    return () => window.clearTimeout(timer);
  }, [armed]);
  return [armed, () => setArmed(false)];
}

export function YesNoEntry({ entry, onAnswer }: YesNoEntryProps) {
  const { t } = useTranslation('checks');
  const [armed, disarm] = useArmed();
  const pick = (value: boolean) => {
    disarm();
    onAnswer(value);
  };
  const answer = entry !== undefined && 'answer' in entry ? entry.answer : null;
  const style = (selected: boolean) =>
    `flex min-h-[180px] flex-1 items-center justify-center rounded-2xl border-4 text-[64px] font-bold tracking-wide active:scale-[0.98] disabled:opacity-60 ${
      selected
        ? 'border-signal-edge bg-signal-bright text-on-fill'
        : 'border-ink-line bg-ink-raised text-paper'
    }`;
  return (
    <div className="flex gap-6">
      <button
        type="button"
        aria-label={t('yesNo.yes')}
        aria-pressed={answer === true}
        disabled={!armed}
        className={style(answer === true)}
        onClick={() => pick(true)}
      >
        {t('yesNo.yesShown')}
      </button>
      <button
        type="button"
        aria-label={t('yesNo.no')}
        aria-pressed={answer === false}
        disabled={!armed}
        className={style(answer === false)}
        onClick={() => pick(false)}
      >
        {t('yesNo.noShown')}
      </button>
    </div>
  );
}
