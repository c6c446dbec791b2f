import { useState, type ReactNode } from 'react';
import type { Checkpoint, ReadingEntry, Unit } from '@shared/schemas/limits';
import { convert, formatValue } from '@shared/domain/units';
import { Button } from '@/components/ui/button';
import { Keypad } from '@/components/ui/keypad';
import { Stepper } from '@/components/ui/stepper';

interface ValueEntryProps {
  checkpoint: Checkpoint;
  entry: ReadingEntry | undefined;
  unit: Unit;
  onEntry: (entry: ReadingEntry) => void;
  onUnit: (unit: Unit) => void;
  onClear: () => void;
  verdict: ReactNode;
}

/** The units a gauge of this kind is commonly marked in; the canonical unit first. */
export function unitChoices(checkpoint: Checkpoint): Unit[] {
  switch (checkpoint.kind) {
    case 'pressure':
      return ['bar', 'psi'];
    case 'temperature':
      return ['C', 'F'];
    case 'quantity':
    case 'level':
      return ['L', 'US_qt'];
    default:
      return [];
  }
}

const stepFor: Partial<Record<Unit, number>> = { bar: 0.5, psi: 5, kPa: 50, C: 1, F: 1, L: 0.1, US_qt: 0.1 };
const unitWords: Partial<Record<Unit, string>> = {
  bar: 'bar',
  psi: 'psi',
  C: '°C',
  F: '°F',
  L: 'L',
  US_qt: 'US qt',
};

const trim = (value: number) => String(Number(value.toFixed(4)));

export function ValueEntry({ checkpoint, entry, unit, onEntry, onUnit, onClear, verdict }: ValueEntryProps) {
  const value = entry !== undefined && 'value' in entry ? entry.value : null;
  const [typed, setTyped] = useState<string>(value === null ? '' : trim(value));
  const step = stepFor[unit] ?? 1;

  const commit = (text: string) => {
    setTyped(text);
    const parsed = Number(text);
    if (text !== '' && text !== '.' && Number.isFinite(parsed)) onEntry({ value: parsed, unit });
  };
  const type = (digit: string) => {
    if (digit === '.' && typed.includes('.')) return;
    if (typed.replace('.', '').length >= 6) return;
    commit(typed === '0' && digit !== '.' ? digit : typed + digit);
  };
  const switchUnit = (next: Unit) => {
    if (next === unit) return;
    onUnit(next);
    // The gauge reading is a physical quantity: switching the unit shows the same pressure, unrounded.
    if (value !== null) {
      const converted = convert(value, unit, next);
      setTyped(trim(converted));
      onEntry({ value: converted, unit: next });
    }
  };

  return (
    <div className="flex gap-6 portrait:flex-col">
      <div className="flex min-w-0 flex-1 flex-col gap-4">
        <Stepper
          name={checkpoint.label}
          canDecrease={
            value !== null &&
            value - step >= convert(checkpoint.range.min, checkpoint.unit ?? unit, unit) - 1e-9
          }
          canIncrease={value !== null}
          onStep={(direction) => {
            if (value === null) return;
            const next = Number((value + direction * step).toFixed(6));
            setTyped(trim(next));
            onEntry({ value: next, unit });
          }}
        >
          <output
            data-testid="reading-value"
            className="tabular flex items-baseline gap-3 py-3 text-[72px] font-bold leading-none"
          >
            {typed === '' ? (
              <span className="text-[28px] font-normal text-ink-muted">Read the gauge</span>
            ) : (
              typed
            )}
            <span className="text-[32px] font-semibold text-ink-muted">{unitWords[unit] ?? unit}</span>
          </output>
        </Stepper>
        <div className="flex flex-wrap gap-3" role="group" aria-label="Unit on the gauge">
          {unitChoices(checkpoint).map((choice) => (
            <Button
              key={choice}
              tone={choice === unit ? 'primary' : 'neutral'}
              size="large"
              aria-pressed={choice === unit}
              aria-label={`Unit ${unitWords[choice] ?? choice}`}
              onClick={() => switchUnit(choice)}
            >
              {unitWords[choice] ?? choice}
            </Button>
          ))}
          <Button
            tone="quiet"
            size="large"
            onClick={() => {
              setTyped('');
              onClear();
            }}
            aria-label="Clear value"
          >
            Clear
          </Button>
        </div>
        <p className="text-[22px] text-ink-muted">
          The gauge shows {formatValue(convert(checkpoint.range.min, checkpoint.unit ?? unit, unit), unit)} to{' '}
          {formatValue(convert(checkpoint.range.max, checkpoint.unit ?? unit, unit), unit)}, in the unit it is
          marked in.
        </p>
        {verdict}
      </div>
      <div className="w-[380px] portrait:mx-auto portrait:w-full portrait:max-w-[460px]">
        <Keypad
          decimal
          onDigit={type}
          onBackspace={() => {
            const next = typed.slice(0, -1);
            if (next === '' || next === '.') {
              setTyped(next);
              onClear();
            } else commit(next);
          }}
        />
      </div>
    </div>
  );
}
