import { useState, type ReactNode } from 'react';
import { isPin } from '@shared/schemas/plain';
import { Button } from './button';
import { Keypad } from './keypad';
import { Notice } from './notice';
import { useTranslation } from 'react-i18next';

/** A PIN has 4 to 8 digits; the keypad stops taking digits after the eighth. */
export const maxPinDigits = 8;
export const addPinDigit = (pin: string, digit: string) => (pin.length < maxPinDigits ? pin + digit : pin);

/** A PIN shown as filled dots only: the digits never appear on a shared tablet's screen. */
export function PinDots({ length, testId }: { length: number; testId: string }) {
  return (
    <div
      role="status"
      aria-live="polite"
      aria-label={`${length} digits entered`}
      data-testid={testId}
      className="flex min-h-[96px] items-center gap-4 rounded-xl border-2 border-ink-line bg-ink-soft px-6"
    >
      {Array.from({ length: Math.max(4, length) }, (_, index) => (
        <span
          key={index}
          className={`h-8 w-8 rounded-full border-[3px] ${index < length ? 'border-paper bg-paper' : 'border-ink-line'}`}
        />
      ))}
    </div>
  );
}

/** The glove-sized keypad typing into a PIN. */
export function PinKeypad({
  value,
  onChange,
  disabled = false,
}: {
  value: string;
  onChange: (next: string) => void;
  disabled?: boolean;
}) {
  return (
    <Keypad
      disabled={disabled}
      onDigit={(digit) => onChange(addPinDigit(value, digit))}
      onBackspace={() => onChange(value.slice(0, -1))}
    />
  );
}

/** The one way a PIN is typed on a kiosk: what it is for, the dots, the keypad. */
export function PinEntry({
  label,
  value,
  onChange,
  testId,
  disabled = false,
}: {
  label: ReactNode;
  value: string;
  onChange: (next: string) => void;
  testId: string;
  disabled?: boolean;
}) {
  return (
    <div className="flex flex-col gap-3">
      <span className="text-[24px] font-semibold">{label}</span>
      <PinDots length={value.length} testId={testId} />
      <div className="max-w-[420px]">
        <PinKeypad value={value} onChange={onChange} disabled={disabled} />
      </div>
    </div>
  );
}

/**
 * A whole screen that signs with the PIN: what is signed and by whom, the dots, a way back and the sign button on
 * the left, the keypad on the right. Re-entering the PIN is the signature (FAA AC 120-78B: a deliberate act).
 */
export function PinSigningScreen({
  title,
  children,
  testId,
  problem,
  pending = false,
  backLabel,
  onBack,
  signLabel,
  onSign,
}: {
  title: ReactNode;
  children: ReactNode;
  testId: string;
  problem?: string | null;
  pending?: boolean;
  backLabel: string;
  onBack: () => void;
  signLabel: string;
  onSign: (pin: string) => void;
}) {
  const { t } = useTranslation('common');
  const [pin, setPin] = useState('');
  return (
    <>
      <div className="flex flex-col gap-5">
        <h2 className="text-[40px] font-bold">{title}</h2>
        <p className="text-lead">{children}</p>
        <PinDots length={pin.length} testId={testId} />
        {problem && (
          <Notice tone="caution" title={t('pin.notSigned')}>
            {problem}
          </Notice>
        )}
        <div className="flex gap-4">
          <Button tone="neutral" size="large" onClick={onBack} className="min-w-[200px]">
            {backLabel}
          </Button>
          <Button
            tone="go"
            size="huge"
            className="flex-1"
            disabled={!isPin(pin) || pending}
            onClick={() => {
              onSign(pin);
              setPin('');
            }}
          >
            {signLabel}
          </Button>
        </div>
      </div>
      <PinKeypad value={pin} onChange={setPin} disabled={pending} />
    </>
  );
}
