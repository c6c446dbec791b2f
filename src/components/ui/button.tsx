import type { ButtonHTMLAttributes, ReactNode } from 'react';
import { useDensity, type Density } from './density';

type Tone = 'primary' | 'neutral' | 'quiet' | 'go' | 'stop';
type Size = 'touch' | 'large' | 'huge';

const tones: Record<Tone, string> = {
  primary: 'bg-signal-bright text-on-fill border-signal-edge',
  neutral: 'bg-ink-raised text-paper border-ink-line',
  quiet: 'bg-transparent text-paper border-ink-line',
  go: 'bg-normal-bright text-on-fill border-normal-edge',
  stop: 'bg-warning text-white border-warning-edge',
};

const sizes: Record<Density, Record<Size, string>> = {
  kiosk: {
    touch: 'min-h-touch min-w-touch gap-3 rounded-xl px-5 text-[22px]',
    large: 'min-h-touch-lg min-w-touch-lg gap-3 rounded-xl px-7 text-[28px]',
    huge: 'min-h-[140px] min-w-touch-lg gap-3 rounded-xl px-8 text-[36px]',
  },
  desk: {
    touch: 'h-10 gap-2 rounded-lg px-4 text-[17px]',
    large: 'h-12 gap-2 rounded-lg px-5 text-[19px]',
    huge: 'h-14 gap-2 rounded-lg px-6 text-[22px]',
  },
};

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  tone?: Tone;
  size?: Size;
  children: ReactNode;
}

/** The one button: on the kiosk never smaller than a gloved fingertip (76 CSS px, about 20 mm), denser at the desk. */
export function Button({
  tone = 'neutral',
  size = 'touch',
  className = '',
  type = 'button',
  children,
  ...rest
}: ButtonProps) {
  const density = useDensity();
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center border-2 font-semibold leading-tight transition-transform active:scale-[0.97] disabled:cursor-not-allowed disabled:opacity-45 ${tones[tone]} ${sizes[density][size]} ${className}`}
      {...rest}
    >
      {children}
    </button>
  );
}
