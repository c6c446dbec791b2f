import type { Verdict } from '@shared/schemas/limits';
import { verdictLabels } from '@shared/schemas/plain';
import { ShapeIcon, verdictShape } from './shapes';

const fills: Record<Verdict, string> = {
  in_limits: 'bg-normal-bright text-on-fill [--shape-ink:#3ecf6a]',
  service: 'bg-caution-bright text-on-fill [--shape-ink:#ffb81c]',
  out_of_limits: 'bg-warning text-white border-2 border-warning-edge [--shape-ink:#8f1d17]',
};

const sizes = {
  md: { box: 'px-3 py-1.5 text-[22px] gap-2 rounded-lg', icon: 26 },
  lg: { box: 'px-5 py-3 text-[32px] gap-3 rounded-xl', icon: 40 },
} as const;

/** A verdict is always word + shape + colour, never colour alone. */
export function VerdictBadge({ verdict, size = 'md' }: { verdict: Verdict; size?: keyof typeof sizes }) {
  const s = sizes[size];
  return (
    <span
      data-testid="verdict"
      data-verdict={verdict}
      className={`inline-flex items-center font-bold uppercase tracking-wide ${fills[verdict]} ${s.box}`}
    >
      <ShapeIcon shape={verdictShape[verdict]} size={s.icon} className="text-current [color:inherit]" />
      <span>{verdictLabels[verdict]}</span>
    </span>
  );
}
