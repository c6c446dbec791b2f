import { Keypad } from './keypad';

/** A PIN typed again on the kiosk's keypad to sign something: shown as dots, at most 8 digits. */
export function PinAgain({
  label,
  testId,
  pin,
  onChange,
}: {
  label: string;
  testId: string;
  pin: string;
  onChange: (update: (pin: string) => string) => void;
}) {
  return (
    <div className="flex flex-col gap-3">
      <span className="text-[24px] font-semibold">{label}</span>
      <div className="tabular text-[44px] font-bold tracking-[0.4em]" data-testid={testId} aria-live="polite">
        {pin ? (
          '•'.repeat(pin.length)
        ) : (
          <span className="text-[26px] tracking-normal text-ink-muted">No digits yet</span>
        )}
      </div>
      <div className="max-w-[420px]">
        <Keypad
          onDigit={(digit) => onChange((s) => (s.length < 8 ? s + digit : s))}
          onBackspace={() => onChange((s) => s.slice(0, -1))}
        />
      </div>
    </div>
  );
}
