import { airframeStateLabels, type AirframeState } from '../../../shared/schemas/api';
import { ShapeIcon, stateShape } from './shapes';

const darkTones: Record<AirframeState, string> = {
  released: 'bg-normal-bright text-ink [--shape-ink:#3ecf6a]',
  due: 'bg-caution-bright text-ink [--shape-ink:#ffb81c]',
  in_progress: 'bg-signal-bright text-ink [--shape-ink:#5aa9ff]',
  hold: 'bg-warning text-white border-2 border-warning-bright [--shape-ink:#8f1d17]',
  not_checked: 'bg-ink-raised text-paper border-2 border-ink-line [--shape-ink:#243646]',
};

/** An airframe's state as word + shape + colour. */
export function StateBadge({ state, size = 'md' }: { state: AirframeState; size?: 'md' | 'lg' | 'xl' }) {
  const box =
    size === 'xl'
      ? 'px-5 py-3 text-[40px] gap-3'
      : size === 'lg'
        ? 'px-4 py-2 text-[30px] gap-3'
        : 'px-3 py-1.5 text-[22px] gap-2';
  const icon = size === 'xl' ? 46 : size === 'lg' ? 36 : 26;
  return (
    <span
      data-testid="airframe-state"
      data-state={state}
      className={`inline-flex items-center rounded-lg font-bold uppercase tracking-wide ${darkTones[state]} ${box}`}
    >
      <ShapeIcon shape={stateShape[state]} size={icon} />
      <span>{airframeStateLabels[state]}</span>
    </span>
  );
}
