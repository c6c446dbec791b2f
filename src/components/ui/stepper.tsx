import type { ReactNode } from 'react';
import { HoldRepeatButton } from './hold-repeat-button';
import { useTranslation } from 'react-i18next';

interface StepperProps {
  /** What is being changed, for the buttons' accessible names ("Less ambient temperature"). */
  name: string;
  onStep: (direction: -1 | 1) => void;
  canDecrease?: boolean;
  canIncrease?: boolean;
  children: ReactNode;
}

/** Big − / + around a value display; press and hold repeats. */
export function Stepper({ name, onStep, canDecrease = true, canIncrease = true, children }: StepperProps) {
  const { t } = useTranslation('common');
  return (
    <div className="flex items-stretch gap-3">
      <HoldRepeatButton label={t('stepper.less', { name })} onStep={() => onStep(-1)} disabled={!canDecrease}>
        <span aria-hidden>−</span>
      </HoldRepeatButton>
      <div className="flex min-w-0 flex-1 items-center justify-center rounded-xl border-2 border-ink-line bg-ink px-4">
        {children}
      </div>
      <HoldRepeatButton label={t('stepper.more', { name })} onStep={() => onStep(1)} disabled={!canIncrease}>
        <span aria-hidden>+</span>
      </HoldRepeatButton>
    </div>
  );
}
