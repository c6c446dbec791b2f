import type { ReactNode } from 'react';
import type { CheckContext, ContextKey } from '@shared/schemas/limits';
import { convert } from '@shared/domain/units';
import { Button } from '@/components/ui/button';
import { Stepper } from '@/components/ui/stepper';
import { Stroke } from '@/components/ui/stroke';

interface ContextStepProps {
  requires: ContextKey[];
  context: CheckContext;
  ambientFromMemory: boolean;
  tempUnit: 'C' | 'F';
  onChange: (context: CheckContext, ambientFromMemory: boolean) => void;
  onTempUnit: (unit: 'C' | 'F') => void;
  onNext: () => void;
}

const quickC = [0, 5, 10, 15, 20, 25, 30, 35];
const quickF = [32, 40, 50, 60, 70, 80, 90, 100];
const minC = -60;
const maxC = 70;

function Choice({
  label,
  selected,
  onPick,
  icon,
  detail,
}: {
  label: string;
  selected: boolean;
  onPick: () => void;
  icon: ReactNode;
  detail?: string;
}) {
  return (
    <button
      type="button"
      aria-label={label}
      aria-pressed={selected}
      onClick={onPick}
      className={`flex min-h-[150px] flex-1 items-center gap-5 rounded-xl border-4 px-5 text-left active:scale-[0.98] ${selected ? 'border-signal-bright bg-signal-bright text-ink' : 'border-ink-line bg-ink-raised text-paper'}`}
    >
      <span className="shrink-0">{icon}</span>
      <span className="flex flex-col">
        <span className="text-[32px] font-bold leading-tight">{label}</span>
        {detail && <span className="text-[22px] leading-snug">{detail}</span>}
      </span>
    </button>
  );
}

const roundTemp = (value: number) => Math.round(value * 10) / 10;

export function ContextStep({
  requires,
  context,
  ambientFromMemory,
  tempUnit,
  onChange,
  onTempUnit,
  onNext,
}: ContextStepProps) {
  const needs = (key: ContextKey) => requires.includes(key);
  const complete = requires.every((key) => context[key] !== undefined);
  const shownTemp =
    context.ambientTempC === undefined
      ? null
      : tempUnit === 'C'
        ? context.ambientTempC
        : convert(context.ambientTempC, 'C', 'F');
  const setShownTemp = (shown: number) => {
    const celsius = tempUnit === 'C' ? shown : convert(shown, 'F', 'C');
    onChange({ ...context, ambientTempC: Math.min(maxC, Math.max(minC, celsius)) }, false);
  };

  return (
    <div className="flex flex-col gap-6">
      <p className="text-lead">Tell the card how the aircraft stands. The limits depend on it.</p>
      {needs('attitude') && (
        <fieldset className="flex flex-col gap-3">
          <legend className="mb-2 text-[24px] font-semibold uppercase tracking-[0.1em] text-ink-muted">
            Aircraft
          </legend>
          <div className="flex gap-4 portrait:flex-col">
            <Choice
              label="On wheels"
              selected={context.attitude === 'on_wheels'}
              onPick={() => onChange({ ...context, attitude: 'on_wheels' }, ambientFromMemory)}
              icon={<WheelsIcon />}
            />
            <Choice
              label="On jacks, gear retracted"
              selected={context.attitude === 'on_jacks_gear_retracted'}
              onPick={() => onChange({ ...context, attitude: 'on_jacks_gear_retracted' }, ambientFromMemory)}
              icon={<JacksIcon />}
            />
          </div>
        </fieldset>
      )}
      {needs('systemPressure') && (
        <fieldset className="flex flex-col gap-3">
          <legend className="mb-2 text-[24px] font-semibold uppercase tracking-[0.1em] text-ink-muted">
            Hydraulic system pressure
          </legend>
          <div className="flex gap-4 portrait:flex-col">
            <Choice
              label="Pressure on"
              detail="Pumps running or accumulator charged"
              selected={context.systemPressure === 'on'}
              onPick={() => onChange({ ...context, systemPressure: 'on' }, ambientFromMemory)}
              icon={<GaugeIcon on />}
            />
            <Choice
              label="Relieved"
              detail="System pressure bled to zero"
              selected={context.systemPressure === 'relieved'}
              onPick={() => onChange({ ...context, systemPressure: 'relieved' }, ambientFromMemory)}
              icon={<GaugeIcon on={false} />}
            />
          </div>
        </fieldset>
      )}
      {needs('ambientTempC') && (
        <fieldset className="flex flex-col gap-3">
          <legend className="mb-2 text-[24px] font-semibold uppercase tracking-[0.1em] text-ink-muted">
            Ambient temperature
          </legend>
          <div className="flex flex-wrap items-stretch gap-4">
            <div className="min-w-[420px] flex-1 portrait:min-w-full">
              <Stepper
                name="ambient temperature"
                canDecrease={shownTemp !== null}
                canIncrease={shownTemp !== null}
                onStep={(direction) => shownTemp !== null && setShownTemp(roundTemp(shownTemp + direction))}
              >
                <output data-testid="ambient-temp" className="tabular text-reading font-bold">
                  {shownTemp === null ? (
                    <span className="text-[26px] font-normal text-ink-muted">Not set</span>
                  ) : (
                    `${roundTemp(shownTemp)} °${tempUnit}`
                  )}
                </output>
              </Stepper>
            </div>
            <div className="flex gap-3" role="group" aria-label="Temperature unit">
              {(['C', 'F'] as const).map((unit) => (
                <Button
                  key={unit}
                  tone={tempUnit === unit ? 'primary' : 'neutral'}
                  size="large"
                  aria-pressed={tempUnit === unit}
                  aria-label={`Degrees ${unit}`}
                  onClick={() => onTempUnit(unit)}
                >
                  °{unit}
                </Button>
              ))}
            </div>
          </div>
          {ambientFromMemory && shownTemp !== null && (
            <p className="text-[22px] text-caution-text">
              Last value entered on this tablet. Check the hangar thermometer and change it if needed.
            </p>
          )}
          <div className="flex flex-wrap gap-2" role="group" aria-label="Quick temperature">
            {(tempUnit === 'C' ? quickC : quickF).map((value) => (
              <Button
                key={value}
                tone="quiet"
                aria-label={`${value} degrees ${tempUnit}`}
                onClick={() => setShownTemp(value)}
                className="min-w-[84px]"
              >
                {value}°
              </Button>
            ))}
          </div>
        </fieldset>
      )}
      <div className="flex justify-end">
        <Button tone="primary" size="large" disabled={!complete} onClick={onNext} className="min-w-[260px]">
          Next
        </Button>
      </div>
    </div>
  );
}

function WheelsIcon() {
  return (
    <svg width="120" height="84" viewBox="0 0 120 84" aria-hidden>
      <path d="M8 30h80l20-12h6v8l-18 16H20Z" fill="currentColor" opacity="0.9" />
      <path d="M30 42v18M84 42v18" stroke="currentColor" strokeWidth="5" />
      <circle cx="30" cy="66" r="10" fill="none" stroke="currentColor" strokeWidth="5" />
      <circle cx="84" cy="66" r="10" fill="none" stroke="currentColor" strokeWidth="5" />
      <path d="M2 80h116" stroke="currentColor" strokeWidth="4" />
    </svg>
  );
}

function JacksIcon() {
  return (
    <svg width="120" height="84" viewBox="0 0 120 84" aria-hidden>
      <path d="M8 18h80l20-12h6v8l-18 16H20Z" fill="currentColor" opacity="0.9" />
      <path d="M26 34l8-4M80 34l8-4" stroke="currentColor" strokeWidth="5" strokeLinecap="round" />
      <path d="M30 30v22M84 30v22" stroke="currentColor" strokeWidth="4" strokeDasharray="4 3" />
      <Stroke d="M22 80l8-28 8 28ZM76 80l8-28 8 28Z" width={4} />
      <path d="M2 80h116" stroke="currentColor" strokeWidth="4" />
    </svg>
  );
}

function GaugeIcon({ on }: { on: boolean }) {
  return (
    <svg width="84" height="84" viewBox="0 0 84 84" aria-hidden>
      <circle cx="42" cy="42" r="36" fill="none" stroke="currentColor" strokeWidth="5" />
      <path
        d="M18 58A28 28 0 1 1 66 58"
        fill="none"
        stroke="currentColor"
        strokeWidth="3"
        strokeDasharray="3 6"
      />
      <path
        d={on ? 'M42 42L62 24' : 'M42 42L20 58'}
        stroke="currentColor"
        strokeWidth="6"
        strokeLinecap="round"
      />
      <circle cx="42" cy="42" r="6" fill="currentColor" />
    </svg>
  );
}
