import { useState } from 'react';
import { isPin } from '@shared/schemas/plain';
import { Button } from '@/components/ui/button';
import { Keypad } from '@/components/ui/keypad';
import { Notice } from '@/components/ui/notice';
import { PinDots } from '@/components/ui/pin-dots';

interface SignStepProps {
  fleetNumber: string;
  kindLabel: string;
  signerName: string;
  pending: boolean;
  problem: string | null;
  onSign: (pin: string) => void;
  onBack: () => void;
}

/** Re-entering the PIN is the signature: a deliberate act by the badge holder, bound to what was reviewed. */
export function SignStep({
  fleetNumber,
  kindLabel,
  signerName,
  pending,
  problem,
  onSign,
  onBack,
}: SignStepProps) {
  const [pin, setPin] = useState('');
  const ready = isPin(pin) && !pending;
  return (
    <div className="grid gap-6 landscape:grid-cols-[1fr_420px]">
      <div className="flex flex-col gap-5">
        <h2 className="text-[40px] font-bold">Sign the {kindLabel.toLowerCase()} check</h2>
        <p className="text-lead">
          {signerName}, your PIN signs these readings on <strong>{fleetNumber}</strong> as yours. A signed
          check is never changed; a correction is a new check.
        </p>
        <PinDots length={pin.length} testId="sign-pin-dots" />
        {problem && (
          <Notice tone="caution" title="Not signed">
            {problem}
          </Notice>
        )}
        <div className="flex gap-4">
          <Button tone="neutral" size="large" onClick={onBack} className="min-w-[200px]">
            Back
          </Button>
          <Button
            tone="go"
            size="huge"
            className="flex-1"
            disabled={!ready}
            onClick={() => {
              onSign(pin);
              setPin('');
            }}
          >
            {pending ? 'Sending…' : 'Sign'}
          </Button>
        </div>
      </div>
      <Keypad
        disabled={pending}
        onDigit={(digit) => setPin((value) => (value.length < 8 ? value + digit : value))}
        onBackspace={() => setPin((value) => value.slice(0, -1))}
      />
    </div>
  );
}
