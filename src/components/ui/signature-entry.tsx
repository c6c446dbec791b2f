import { PinEntry } from './pin-entry';
import { inputClass } from '@/components/desk/desk-form';
import { useTranslation } from 'react-i18next';

export type SigningChannel = 'kiosk' | 'desk';

/** The body of a signed request: the PIN on a kiosk, the password at the desk (FAA AC 120-78B: typed per act). */
export const secretFor = (channel: SigningChannel, secret: string) =>
  channel === 'kiosk' ? { pin: secret } : { password: secret };

/**
 * The signer's secret typed again for one act: the glove-sized keypad on a kiosk (dots only, never the digits),
 * a password field at the desk.
 */
export function SignatureEntry({
  channel,
  value,
  onChange,
  onEnter,
  testId,
  label: given,
}: {
  channel: SigningChannel;
  value: string;
  onChange: (next: string) => void;
  onEnter?: () => void;
  testId: string;
  label?: string;
}) {
  const { t } = useTranslation('common');
  const label = given ?? t(channel === 'kiosk' ? 'signature.pin' : 'signature.password');
  if (channel === 'desk') {
    return (
      <label className="flex flex-col gap-2">
        <span className="text-[17px] font-semibold">{label}</span>
        <input
          type="password"
          autoComplete="current-password"
          data-testid={testId}
          value={value}
          onChange={(event) => onChange(event.target.value)}
          onKeyDown={(event) => {
            if (event.key === 'Enter') onEnter?.();
          }}
          className={`${inputClass} max-w-[480px]`}
        />
      </label>
    );
  }
  return <PinEntry label={label} value={value} onChange={onChange} testId={testId} />;
}
