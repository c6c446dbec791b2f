import { useEffect, useRef, type ReactNode } from 'react';

interface HoldRepeatButtonProps {
  label: string;
  onStep: () => void;
  disabled?: boolean;
  className?: string;
  children: ReactNode;
}

const firstRepeatMs = 450;
const repeatMs = 110;

/**
 * Steps once on press and keeps stepping while held, so a glove can walk a value a long way without
 * dozens of taps. Keyboard activation (Enter/Space) steps once.
 */
export function HoldRepeatButton({
  label,
  onStep,
  disabled = false,
  className = '',
  children,
}: HoldRepeatButtonProps) {
  const timer = useRef<number | null>(null);
  const step = useRef(onStep);
  step.current = onStep;

  const stop = () => {
    if (timer.current !== null) window.clearTimeout(timer.current);
    timer.current = null;
  };
  useEffect(() => stop, []);

  const repeat = () => {
    step.current();
    timer.current = window.setTimeout(repeat, repeatMs);
  };

  return (
    <button
      type="button"
      aria-label={label}
      disabled={disabled}
      className={`flex min-h-touch-lg min-w-touch-lg select-none items-center justify-center rounded-xl border-2 border-ink-line bg-ink-raised text-[48px] font-bold leading-none text-paper active:scale-[0.96] active:bg-ink-line disabled:opacity-40 ${className}`}
      onPointerDown={(event) => {
        if (event.button !== 0) return;
        event.currentTarget.setPointerCapture(event.pointerId);
        stop();
        step.current();
        timer.current = window.setTimeout(repeat, firstRepeatMs);
      }}
      onPointerUp={stop}
      onPointerCancel={stop}
      onLostPointerCapture={stop}
      onContextMenu={(event) => event.preventDefault()}
      onClick={(event) => {
        // Pointer presses were already counted on pointerdown; only keyboard clicks (detail 0) step here.
        if (event.detail === 0) step.current();
      }}
    >
      {children}
    </button>
  );
}
