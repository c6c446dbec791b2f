import i18next from 'i18next';
import { useState } from 'react';
import type { UsageFigures } from '@shared/schemas/usage';
import { formatFigure, usageFlown } from '@shared/domain/usage';
import { Button } from './button';
import { Keypad } from './keypad';
import { Notice } from './notice';
import { Stepper } from './stepper';
import { useTranslation } from 'react-i18next';
import { hoursText, typedInLanguage } from '@/lib/typed-number';

type Field = keyof UsageFigures;

const fields = [
  { field: 'hours', label: 'usage.hours', step: 0.1 },
  { field: 'flights', label: 'usage.flights', step: 1 },
  { field: 'landings', label: 'usage.landings', step: 1 },
] as const satisfies readonly { field: Field; label: string; step: number }[];

/** A figure as typed on the keypad ("1234.5"); the screen writes it with its language's decimal sign. */
const typedOf = (field: Field, value: number) => (field === 'hours' ? value.toFixed(1) : String(value));
/** A figure as the screen shows it: hours with one decimal in the screen's language ("1234,5" in German). */
const shown = (field: Field, value: number, language: string) =>
  field === 'hours' ? hoursText(value, language) : String(value);

/**
 * The airframe's hours, flights and landings as the aircraft shows them at the end of a flight, for the
 * after-flight check and the pilot's close of a flight: one figure at a time, by − / + (hold to repeat) or by the
 * keypad. Starts from the last recorded figures and says what the entry adds, so a slipped digit shows before it
 * is signed. `stacked` puts the keypad under the figures, for a narrow column.
 */
export function UsageEntry({
  last,
  value,
  onChange,
  stacked = false,
}: {
  last: UsageFigures;
  value: UsageFigures;
  onChange: (value: UsageFigures) => void;
  stacked?: boolean;
}) {
  const [selected, setSelected] = useState<Field>('hours');
  // The first key typed after choosing a figure replaces it; the next ones add digits.
  const [typed, setTyped] = useState<string | null>(null);
  const flown = usageFlown(last, value);
  const set = (field: Field, next: number) => onChange({ ...value, [field]: next });
  const { t, i18n } = useTranslation('common');
  const language = i18n.resolvedLanguage ?? 'en';
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
    const next = (typed ?? typedOf(selected, value[selected])).slice(0, -1);
    setTyped(next);
    set(selected, next === '' || next === '.' ? 0 : Number(next));
  };
  const current = fields.find((f) => f.field === selected)!;
  // A slipped digit that takes a figure below the last one is said here, not only when signing is refused.
  const below = fields.filter(({ field }) => value[field] < last[field]);
  // Beside the keypad in landscape; under it when the keypad is under the figures, so it never moves the keys a
  // gloved finger is about to tap.
  const caution = below.length > 0 && (
    <Notice tone="caution" title={t('usage.belowTitle')}>
      <span data-testid="usage-below">
        {below
          .map(({ field, label }) =>
            t('usage.belowLast', { figure: t(label), last: formatFigure(field, last[field]) }),
          )
          .join(' ')}
      </span>
    </Notice>
  );

  return (
    <div className={`flex gap-6 ${stacked ? 'flex-col' : 'portrait:flex-col'}`}>
      <div className="flex min-w-0 flex-1 flex-col gap-4">
        <div
          className={`grid gap-3 ${stacked ? 'grid-cols-1' : 'grid-cols-3'}`}
          role="group"
          aria-label={t('usage.figure')}
        >
          {fields.map(({ field, label }) => (
            <Button
              key={field}
              size="large"
              tone={field === selected ? 'primary' : 'neutral'}
              aria-pressed={field === selected}
              onClick={() => choose(field)}
            >
              <span className="flex flex-col items-center">
                <span>{t(label)}</span>
                <span className="tabular text-[24px]" data-testid={`usage-${field}`}>
                  {shown(field, value[field], language)}
                </span>
              </span>
            </Button>
          ))}
        </div>
        <Stepper
          name={t(current.label).toLowerCase()}
          canDecrease={value[selected] - current.step >= -1e-9}
          onStep={(direction) => {
            setTyped(null);
            set(selected, Number((value[selected] + direction * current.step).toFixed(1)));
          }}
        >
          <output className="tabular py-3 text-[64px] font-bold leading-none" aria-label={t(current.label)}>
            {typed === null ? shown(selected, value[selected], language) : typedInLanguage(language, typed)}
          </output>
        </Stepper>
        <p className="text-[24px]" data-testid="usage-flown">
          {t('usage.adds', {
            hours: formatFigure('hours', flown.hours),
            flights: formatFigure('flights', flown.flights),
            landings: formatFigure('landings', flown.landings),
          })}
        </p>
        {caution && <div className={stacked ? 'hidden' : 'portrait:hidden'}>{caution}</div>}
      </div>
      <div
        className={stacked ? 'w-full' : 'w-[380px] portrait:mx-auto portrait:w-full portrait:max-w-[460px]'}
      >
        <Keypad decimal={selected === 'hours'} onDigit={type} onBackspace={backspace} />
      </div>
      {caution && <div className={stacked ? '' : 'hidden portrait:block'}>{caution}</div>}
    </div>
  );
}

/** "Last recorded: 1 234.5 h, 412 flights, 430 landings." */
export const lastUsageWords = (last: UsageFigures) =>
  i18next.t('usage.last', {
    ns: 'common',
    hours: formatFigure('hours', last.hours),
    flights: formatFigure('flights', last.flights),
    landings: formatFigure('landings', last.landings),
  });
