import { useState, type ReactNode } from 'react';
import { levelPositionSchema, type Checkpoint, type ReadingEntry } from '@shared/schemas/limits';
import { Button } from '@/components/ui/button';
import { SightGlass } from '@/components/ui/sight-glass';
import { Stepper } from '@/components/ui/stepper';
import { positionLabels } from '@/lib/describe-entry';

interface LevelEntryProps {
  checkpoint: Checkpoint & { marks: NonNullable<Checkpoint['marks']> };
  entry: ReadingEntry | undefined;
  onEntry: (entry: ReadingEntry) => void;
  verdict: ReactNode;
}

const step = 0.1;

export function LevelEntry({ checkpoint, entry, onEntry, verdict }: LevelEntryProps) {
  const [byPosition, setByPosition] = useState(entry !== undefined && 'position' in entry);
  const value = entry !== undefined && 'value' in entry ? entry.value : null;
  const unit = checkpoint.unit ?? 'L';
  const { min, max } = checkpoint.range;
  const setValue = (next: number) =>
    onEntry({ value: Number(Math.min(max, Math.max(min, next)).toFixed(6)), unit });

  if (byPosition) {
    const selected = entry !== undefined && 'position' in entry ? entry.position : null;
    return (
      <div className="flex flex-col gap-4">
        <p className="text-lead">Where is the fluid against the marks?</p>
        <div className="grid grid-cols-2 gap-3 portrait:grid-cols-1">
          {[...levelPositionSchema.options].reverse().map((position) => (
            <Button
              key={position}
              tone={selected === position ? 'primary' : 'neutral'}
              size="large"
              aria-pressed={selected === position}
              onClick={() => onEntry({ position })}
            >
              {positionLabels[position]}
            </Button>
          ))}
        </div>
        {verdict}
        <Button tone="quiet" onClick={() => setByPosition(false)}>
          This glass has a scale: tap the level
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
        unitLabel={unit}
        onSet={setValue}
        resolution={step}
      />
      <div className="flex min-w-[340px] flex-1 flex-col gap-4 portrait:w-full">
        <Stepper
          name="level"
          canDecrease={value !== null && value > min}
          canIncrease={value !== null && value < max}
          onStep={(direction) => value !== null && setValue(value + direction * step)}
        >
          <output data-testid="level-value" className="tabular text-reading font-bold">
            {value === null ? (
              <span className="text-[26px] font-normal text-ink-muted">Tap the glass</span>
            ) : (
              `${value.toFixed(1)} ${unit}`
            )}
          </output>
        </Stepper>
        <p className="text-[22px] text-ink-muted">
          Tap the glass where you see the fluid; fine-tune with − and + (hold to repeat).
        </p>
        {verdict}
        <Button tone="quiet" onClick={() => setByPosition(true)}>
          No scale on this glass? Pick a position
        </Button>
      </div>
    </div>
  );
}
