import { PinSigningScreen } from '@/components/ui/pin-entry';

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
  return (
    <div className="grid gap-6 landscape:grid-cols-[1fr_420px]">
      <PinSigningScreen
        title={`Sign the ${kindLabel.toLowerCase()} check`}
        testId="sign-pin-dots"
        problem={problem}
        pending={pending}
        backLabel="Back"
        onBack={onBack}
        signLabel={pending ? 'Sending…' : 'Sign'}
        onSign={onSign}
      >
        {signerName}, your PIN signs these readings on <strong>{fleetNumber}</strong> as yours. A signed check
        is never changed; a correction is a new check.
      </PinSigningScreen>
    </div>
  );
}
