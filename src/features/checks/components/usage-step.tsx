import { useState } from 'react';
import type { UsageFigures } from '@shared/schemas/usage';
import { formatFigure, usageFlown } from '@shared/domain/usage';
import { Button } from '@/components/ui/button';
import { Keypad } from '@/components/ui/keypad';
import { Notice } from '@/components/ui/notice';
import { Stepper } from '@/components/ui/stepper';

type Field = keyof UsageFigures;

const fields: { field: Field; label: string; step: number }[] = [
  { field: 'hours', label: 'Airframe hours', step: 0.1 },
  { field: 'flights', label: 'Flights', step: 1 },
  { field: 'landings', label: 'Landings', step: 1 },
];

interface UsageStepProps {
  /** The airframe's figures as last recorded; the entry starts from them. */
  last: UsageFigures;
  value: UsageFigures | undefined;
  /** The server's refusal of the last attempt, in its words. */
  notice: string | null;
  onChange: (value: UsageFigures) => void;
  onBack: () => void;
  onNext: () => void;
}

const shown = (field: Field, value: number) => (field === 'hours' ? value.toFixed(1) : String(value));

/**
 * The airframe's hours, flights and landings as the aircraft shows them at the end of the flight: one figure at a
 * time, by − / + (hold to repeat) or by the keypad. Starts from the last recorded figures and says what the entry
 * adds, so a slip of a digit shows before it is signed.
 */
export function UsageStep({ last, value, notice, onChange, onBack, onNext }: UsageStepProps) {
  const figures = value ?? last;
  const [selected, setSelected] = useState<Field>('hours');
  // The first key typed after choosing a figure replaces it; the next ones add digits.
  const [typed, setTyped] = useState<string | null>(null);
  const flown = usageFlown(last, figures);
  const set = (field: Field, next: number) => onChange({ ...figures, [field]: next });
  const choose = (field: Field) => {
    setSelected(field);
    setTyped(null);
  };
  const type = (digit: string) => {
    const text = typed ?? '';
    if (digit === '.' && (selected !== 'hours' || text.includes('.'))) return;
    if (text.includes('.') && text.split('.')[1]!.length >= 1) return;
    if (text.replace('.', '').length >= 7) return;
    const next = text === '0' && digit !== '.' ? digit : text + digit;
    setTyped(next);
    const parsed = Number(next);
    if (next !== '.' && Number.isFinite(parsed)) set(selected, parsed);
  };
  const backspace = () => {
    const next = (typed ?? shown(selected, figures[selected])).slice(0, -1);
    setTyped(next);
    set(selected, next === '' || next === '.' ? 0 : Number(next));
  };
  const current = fields.find((f) => f.field === selected)!;

  return (
    <div className="flex flex-col gap-5">
      <h2 className="text-[40px] font-bold">Hours, flights and landings</h2>
      <p className="text-[24px] text-ink-muted">
        Enter what the aircraft shows now. Last recorded: {formatFigure('hours', last.hours)},{' '}
        {formatFigure('flights', last.flights)}, {formatFigure('landings', last.landings)}.
      </p>
      {notice && (
        <Notice tone="caution" title="Read the figures again">
          {notice}
        </Notice>
      )}
      <div className="flex gap-6 portrait:flex-col">
        <div className="flex min-w-0 flex-1 flex-col gap-4">
          <div className="grid grid-cols-3 gap-3" role="group" aria-label="Figure to enter">
            {fields.map(({ field, label }) => (
              <Button
                key={field}
                size="large"
                tone={field === selected ? 'primary' : 'neutral'}
                aria-pressed={field === selected}
                onClick={() => choose(field)}
              >
                <span className="flex flex-col items-center">
                  <span>{label}</span>
                  <span className="tabular text-[24px]" data-testid={`usage-${field}`}>
                    {shown(field, figures[field])}
                  </span>
                </span>
              </Button>
            ))}
          </div>
          <Stepper
            name={current.label.toLowerCase()}
            canDecrease={figures[selected] - current.step >= -1e-9}
            onStep={(direction) => {
              setTyped(null);
              set(selected, Number((figures[selected] + direction * current.step).toFixed(1)));
            }}
          >
            <output className="tabular py-3 text-[64px] font-bold leading-none" aria-label={current.label}>
              {typed ?? shown(selected, figures[selected])}
            </output>
          </Stepper>
          <p className="text-[24px]" data-testid="usage-flown">
            This entry adds {formatFigure('hours', flown.hours)}, {formatFigure('flights', flown.flights)} and{' '}
            {formatFigure('landings', flown.landings)}.
          </p>
          <div className="flex gap-4">
            <Button size="large" tone="quiet" onClick={onBack}>
              Back
            </Button>
            <Button
              size="large"
              tone="primary"
              className="flex-1"
              onClick={() => {
                if (!value) onChange(figures);
                onNext();
              }}
            >
              Next
            </Button>
          </div>
        </div>
        <div className="w-[380px] portrait:mx-auto portrait:w-full portrait:max-w-[460px]">
          <Keypad decimal={selected === 'hours'} onDigit={type} onBackspace={backspace} />
        </div>
      </div>
    </div>
  );
}

/** The figures on the review screen, with the way back to them; a check cannot be signed without them. */
export function UsageLine({ usage, onEdit }: { usage: UsageFigures | undefined; onEdit: () => void }) {
  return (
    <div className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-ink-line p-4 text-[24px]">
      <span className="flex-1">
        {usage
          ? `Recorded with this check: ${formatFigure('hours', usage.hours)}, ${formatFigure('flights', usage.flights)}, ${formatFigure('landings', usage.landings)}.`
          : 'The hours, flights and landings are not entered yet.'}
      </span>
      <Button tone={usage ? 'neutral' : 'primary'} onClick={onEdit}>
        {usage ? 'Change figures' : 'Enter figures'}
      </Button>
    </div>
  );
}
