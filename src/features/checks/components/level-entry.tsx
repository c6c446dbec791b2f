import { useEffect, useRef, useState, type ReactNode } from 'react';
import { levelPositionSchema, type Checkpoint, type ReadingEntry } from '@shared/schemas/limits';
import { Button } from '@/components/ui/button';
import { SightGlass } from '@/components/ui/sight-glass';
import { Stepper } from '@/components/ui/stepper';
import { useCheckWords } from '../model/check-words';

interface LevelEntryProps {
  checkpoint: Checkpoint & { marks: NonNullable<Checkpoint['marks']> };
  entry: ReadingEntry | undefined;
  onEntry: (entry: ReadingEntry) => void;
  verdict: ReactNode;
}

const step = 0.1;

export function LevelEntry({ checkpoint, entry, onEntry, verdict }: LevelEntryProps) {
  const { t, words } = useCheckWords();
  const [byPosition, setByPosition] = useState(entry !== undefined && 'position' in entry);
  // One tap on a position is the whole reading: its verdict is then brought clear of the Back/Next bar (the page's
  // scroll-padding keeps that room), so the mechanic sees what the tap means before tapping Next. A glass tap or a
  // keypad key does not scroll: the keys must not move under a gloved finger.
  const verdictRef = useRef<HTMLDivElement>(null);
  const [positionTaps, setPositionTaps] = useState(0);
  useEffect(() => {
    if (positionTaps > 0) verdictRef.current?.scrollIntoView({ block: 'nearest' });
  }, [positionTaps]);
  const value = entry !== undefined && 'value' in entry ? entry.value : null;
  const unit = checkpoint.unit ?? 'L';
  const { min, max } = checkpoint.range;
  const setValue = (next: number) =>
    onEntry({ value: Number(Math.min(max, Math.max(min, next)).toFixed(6)), unit });

  if (byPosition) {
    const selected = entry !== undefined && 'position' in entry ? entry.position : null;
    return (
      <div className="flex flex-col gap-4">
        <p className="text-lead">{t('level.wherePosition')}</p>
        <div className="grid grid-cols-2 gap-3 portrait:grid-cols-1">
          {[...levelPositionSchema.options].reverse().map((position) => (
            <Button
              key={position}
              tone={selected === position ? 'primary' : 'neutral'}
              size="large"
              aria-pressed={selected === position}
              onClick={() => {
                onEntry({ position });
                setPositionTaps((taps) => taps + 1);
              }}
            >
              {words.position(position)}
            </Button>
          ))}
        </div>
        <div ref={verdictRef}>{verdict}</div>
        <Button tone="quiet" onClick={() => setByPosition(false)}>
          {t('level.hasScale')}
        </Button>
      </div>
    );
  }

  return (
    <div className="flex gap-6 portrait:flex-col portrait:items-center">
      <SightGlass
        range={checkpoint.range}
        marks={checkpoint.marks}
        value={value}
        unitLabel={words.unit(unit)}
        onSet={setValue}
        resolution={step}
      />
      <div className="flex min-w-[340px] flex-1 flex-col gap-4 portrait:w-full">
        <Stepper
          name={t('level.stepper')}
          canDecrease={value !== null && value > min}
          canIncrease={value !== null && value < max}
          onStep={(direction) => value !== null && setValue(value + direction * step)}
        >
          <output data-testid="level-value" className="tabular text-reading font-bold">
            {value === null ? (
              <span className="text-[26px] font-normal text-ink-muted">{t('level.tapGlass')}</span>
            ) : (
              t('units.valueWithUnit', { value: words.number(value, 1), unit: words.unit(unit) })
            )}
          </output>
        </Stepper>
        <p className="text-[22px] text-ink-muted">{t('level.hint')}</p>
        {verdict}
        <Button tone="quiet" onClick={() => setByPosition(true)}>
          {t('level.noScale')}
        </Button>
      </div>
    </div>
  );
}
