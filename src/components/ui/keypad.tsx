import type { ReactNode } from 'react';
import { Stroke } from './stroke';
import { useTranslation } from 'react-i18next';
import { decimalSign } from '@/lib/typed-number';

interface KeypadProps {
  onDigit: (digit: string) => void;
  onBackspace: () => void;
  /** Adds a decimal key in the bottom-left corner: it shows the language's sign ("," in German) and types ".". */
  decimal?: boolean;
  /** Replaces the bottom-left key (for example "Clear"). */
  corner?: ReactNode;
  disabled?: boolean;
}

const digits = ['1', '2', '3', '4', '5', '6', '7', '8', '9'];
const key =
  'flex min-h-touch-lg min-w-touch-lg items-center justify-center rounded-xl border-2 border-ink-line bg-ink-raised text-[40px] font-semibold text-paper active:scale-[0.96] active:bg-ink-line disabled:opacity-40';

/** A phone-style pad with keys big enough for a gloved thumb; digits are named "1".."0" for tests and screen readers. */
export function Keypad({ onDigit, onBackspace, decimal = false, corner, disabled = false }: KeypadProps) {
  const { t, i18n } = useTranslation('common');
  return (
    <div className="grid grid-cols-3 gap-3" role="group" aria-label={t('keypad.label')}>
      {digits.map((digit) => (
        <button key={digit} type="button" className={key} disabled={disabled} onClick={() => onDigit(digit)}>
          {digit}
        </button>
      ))}
      {decimal ? (
        <button
          type="button"
          className={key}
          aria-label={t('keypad.decimal')}
          disabled={disabled}
          onClick={() => onDigit('.')}
        >
          {decimalSign(i18n.resolvedLanguage)}
        </button>
      ) : (
        (corner ?? <span aria-hidden />)
      )}
      <button type="button" className={key} disabled={disabled} onClick={() => onDigit('0')}>
        0
      </button>
      <button
        type="button"
        className={key}
        aria-label={t('keypad.delete')}
        disabled={disabled}
        onClick={onBackspace}
      >
        <svg width="44" height="32" viewBox="0 0 44 32" aria-hidden>
          <Stroke d="M14 3h26v26H14L3 16Z" width={3} />
          <path d="M21 10l12 12M33 10L21 22" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
        </svg>
      </button>
    </div>
  );
}
