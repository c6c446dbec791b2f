import { Trans } from 'react-i18next';
import type { CheckKind } from '@shared/schemas/limits';
import { PinSigningScreen } from '@/components/ui/pin-entry';
import { useCheckWords } from '../model/check-words';

interface SignStepProps {
  fleetNumber: string;
  kind: CheckKind;
  signerName: string;
  pending: boolean;
  problem: string | null;
  onSign: (pin: string) => void;
  onBack: () => void;
}

/** Re-entering the PIN is the signature: a deliberate act by the badge holder, bound to what was reviewed. */
export function SignStep({ fleetNumber, kind, signerName, pending, problem, onSign, onBack }: SignStepProps) {
  const { t, words } = useCheckWords();
  return (
    <div className="grid gap-6 landscape:grid-cols-[1fr_420px]">
      <PinSigningScreen
        title={t('sign.title', { check: words.kindCheck(kind) })}
        testId="sign-pin-dots"
        problem={problem}
        pending={pending}
        backLabel={t('nav.back')}
        onBack={onBack}
        signLabel={pending ? t('sign.sending') : t('sign.sign')}
        onSign={onSign}
      >
        <Trans
          t={t}
          i18nKey="sign.body"
          values={{ name: signerName, fleet: fleetNumber }}
          components={{ strong: <strong /> }}
        />
      </PinSigningScreen>
    </div>
  );
}
