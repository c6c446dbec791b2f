import { Keypad } from './keypad';

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
  label = channel === 'kiosk' ? 'Your PIN, typed again to sign' : 'Your password, typed again to sign',
}: {
  channel: SigningChannel;
  value: string;
  onChange: (next: string) => void;
  onEnter?: () => void;
  testId: string;
  label?: string;
}) {
  if (channel === 'desk') {
    return (
      <label className="flex flex-col gap-2">
        <span className="text-[24px] font-semibold">{label}</span>
        <input
          type="password"
          autoComplete="current-password"
          data-testid={testId}
          value={value}
          onChange={(event) => onChange(event.target.value)}
          onKeyDown={(event) => {
            if (event.key === 'Enter') onEnter?.();
          }}
          className="min-h-touch w-full max-w-[480px] rounded-xl border-2 border-ink-line bg-ink px-5 text-[28px] text-paper"
        />
      </label>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <span className="text-[24px] font-semibold">{label}</span>
      <div className="tabular text-[44px] font-bold tracking-[0.4em]" data-testid={testId} aria-live="polite">
        {value ? (
          '•'.repeat(value.length)
        ) : (
          <span className="text-[26px] tracking-normal text-ink-muted">No digits yet</span>
        )}
      </div>
      <div className="max-w-[420px]">
        <Keypad
          onDigit={(digit) => onChange(value.length < 8 ? value + digit : value)}
          onBackspace={() => onChange(value.slice(0, -1))}
        />
      </div>
    </div>
  );
}
