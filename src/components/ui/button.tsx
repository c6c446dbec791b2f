import type { ButtonHTMLAttributes, ReactNode } from 'react';

type Tone = 'primary' | 'neutral' | 'quiet' | 'go' | 'stop';
type Size = 'touch' | 'large' | 'huge';

const tones: Record<Tone, string> = {
  primary: 'bg-signal-bright text-ink border-signal-bright',
  neutral: 'bg-ink-raised text-paper border-ink-line',
  quiet: 'bg-transparent text-paper border-ink-line',
  go: 'bg-normal-bright text-ink border-normal-bright',
  stop: 'bg-warning text-white border-warning-bright',
};

const sizes: Record<Size, string> = {
  touch: 'min-h-touch min-w-touch px-5 text-[22px]',
  large: 'min-h-touch-lg min-w-touch-lg px-7 text-[28px]',
  huge: 'min-h-[140px] min-w-touch-lg px-8 text-[36px]',
};

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  tone?: Tone;
  size?: Size;
  children: ReactNode;
}

/** The kiosk's one button: never smaller than a gloved fingertip (76 CSS px, about 20 mm). */
export function Button({
  tone = 'neutral',
  size = 'touch',
  className = '',
  type = 'button',
  children,
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center gap-3 rounded-xl border-2 font-semibold leading-tight transition-transform active:scale-[0.97] disabled:cursor-not-allowed disabled:opacity-45 ${tones[tone]} ${sizes[size]} ${className}`}
      {...rest}
    >
      {children}
    </button>
  );
}
