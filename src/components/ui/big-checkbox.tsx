import type { ReactNode } from 'react';
import { Stroke } from './stroke';

/** The tick's ink on the blue box. */
const tickInk = 'var(--gw-ink)';

/** A yes/no a gloved finger can set: the whole row is the target (at least 76 CSS px), ticked box + words. */
export function BigCheckbox({
  checked,
  onChange,
  children,
  testId,
}: {
  checked: boolean;
  onChange: (checked: boolean) => void;
  children: ReactNode;
  testId?: string;
}) {
  return (
    <button
      type="button"
      role="checkbox"
      aria-checked={checked}
      data-testid={testId}
      onClick={() => onChange(!checked)}
      className={`flex min-h-touch w-full items-center gap-4 rounded-xl border-2 px-4 py-3 text-left text-[22px] leading-snug ${checked ? 'border-signal-edge bg-ink-raised' : 'border-ink-line bg-ink'}`}
    >
      <svg width="44" height="44" viewBox="0 0 44 44" aria-hidden className="shrink-0">
        <rect
          x="3"
          y="3"
          width="38"
          height="38"
          rx="6"
          fill={checked ? 'var(--gw-signal-edge)' : 'none'}
          stroke={checked ? 'var(--gw-signal-edge)' : 'var(--gw-ink-muted)'}
          strokeWidth="3"
        />
        {checked && <Stroke d="M12 22.5l7 7L32 15" width={4.5} color={tickInk} roundEnds />}
      </svg>
      <span className="min-w-0">{children}</span>
    </button>
  );
}
