import { useState } from 'react';
import type { SessionInfo } from '@shared/schemas/auth';
import { isBadge, isPin } from '@shared/schemas/plain';
import { ApiRequestError, errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Keypad } from '@/components/ui/keypad';
import { Notice } from '@/components/ui/notice';
import { QrScanner } from '@/components/ui/qr-scanner';
import { QrGlyph } from '@/components/ui/qr-glyph';
import { useKioskSignIn } from '../api/kiosk-sign-in';
import { addPinDigit, PinDots } from '@/components/ui/pin-entry';
import { localTime } from '@/lib/when';

interface KioskSignInPanelProps {
  onSignedIn: (session: SessionInfo) => void;
}

type Problem =
  | { kind: 'message'; tone: 'warning' | 'caution'; title: string; text: string }
  | { kind: 'locked'; until: Date; text: string };

const maxBadgeDigits = 12;

/** A QR badge may hold the bare number or a longer text ending in it ("badge:4101", a URL). */
function badgeFromScan(text: string): string | null {
  const candidate =
    text
      .trim()
      .split(/[/:=\s]/)
      .filter(Boolean)
      .pop() ?? '';
  return isBadge(candidate) ? candidate : null;
}

function problemFrom(error: unknown): Problem {
  if (error instanceof ApiRequestError) {
    if (error.code === 'badge_locked' && typeof error.body.lockedUntil === 'string') {
      return { kind: 'locked', until: new Date(error.body.lockedUntil), text: error.message };
    }
    if (error.code === 'kiosk_not_enrolled') {
      return {
        kind: 'message',
        tone: 'warning',
        title: 'This tablet is not enrolled',
        text: `${error.message} Engineering enrols tablets from the desk page "Tablets and TVs".`,
      };
    }
    if (error.code === 'wrong_pin')
      return { kind: 'message', tone: 'caution', title: 'Badge and PIN do not match', text: error.message };
    if (error.code === 'too_many_attempts')
      return { kind: 'message', tone: 'caution', title: 'Too many attempts', text: error.message };
  }
  return { kind: 'message', tone: 'warning', title: 'Not signed in', text: errorMessage(error) };
}

export function KioskSignInPanel({ onSignedIn }: KioskSignInPanelProps) {
  const [step, setStep] = useState<'badge' | 'pin'>('badge');
  const [badge, setBadge] = useState('');
  const [pin, setPin] = useState('');
  const [scanning, setScanning] = useState(false);
  const [scanNote, setScanNote] = useState<string | null>(null);
  const [problem, setProblem] = useState<Problem | null>(null);
  const signIn = useKioskSignIn();

  const badgeOk = isBadge(badge);
  const pinOk = isPin(pin);

  const type = (digit: string) => {
    setProblem(null);
    if (step === 'badge') setBadge((value) => (value.length < maxBadgeDigits ? value + digit : value));
    else setPin((value) => addPinDigit(value, digit));
  };
  const back = () => (step === 'badge' ? setBadge((v) => v.slice(0, -1)) : setPin((v) => v.slice(0, -1)));

  const submit = () => {
    signIn.mutate(
      { badge, pin },
      {
        onSuccess: onSignedIn,
        onError: (error) => {
          setPin('');
          setProblem(problemFrom(error));
        },
      },
    );
  };

  return (
    <div className="grid flex-1 gap-6 landscape:grid-cols-[1fr_minmax(360px,420px)] portrait:grid-cols-1">
      <section className="flex flex-col gap-5">
        <ol className="flex gap-3 text-[22px] font-semibold" aria-label="Sign-in steps">
          <li
            className={`rounded-lg px-4 py-2 ${step === 'badge' ? 'bg-signal-bright text-ink' : 'bg-ink-raised text-paper'}`}
          >
            1 Badge
          </li>
          <li
            className={`rounded-lg px-4 py-2 ${step === 'pin' ? 'bg-signal-bright text-ink' : 'bg-ink-raised text-paper'}`}
          >
            2 PIN
          </li>
        </ol>

        {step === 'badge' ? (
          <>
            <label className="text-lead text-ink-muted" htmlFor="badge-display">
              Badge number
            </label>
            <output
              id="badge-display"
              data-testid="badge-display"
              className="tabular flex min-h-[112px] items-center rounded-xl border-2 border-ink-line bg-ink-soft px-6 text-[64px] font-bold tracking-[0.15em]"
            >
              {badge || (
                <span className="text-[30px] font-normal tracking-normal text-ink-muted">
                  Type or scan your badge
                </span>
              )}
            </output>
            <div className="flex flex-wrap gap-3">
              <Button
                tone="neutral"
                size="large"
                onClick={() => {
                  setScanNote(null);
                  setScanning(true);
                }}
              >
                <QrGlyph /> Scan badge
              </Button>
              <Button
                tone="primary"
                size="large"
                className="flex-1"
                disabled={!badgeOk}
                onClick={() => {
                  setProblem(null);
                  setStep('pin');
                }}
              >
                Next: PIN
              </Button>
            </div>
            {scanNote && <Notice tone="caution">{scanNote}</Notice>}
          </>
        ) : (
          <>
            <div className="flex items-center gap-4">
              <div className="mr-auto">
                <div className="text-lead text-ink-muted">Badge</div>
                <div data-testid="badge-confirmed" className="tabular text-[44px] font-bold">
                  {badge}
                </div>
              </div>
              <Button
                tone="quiet"
                onClick={() => {
                  setPin('');
                  setStep('badge');
                  setProblem(null);
                }}
              >
                Change badge
              </Button>
            </div>
            <div className="text-lead text-ink-muted" id="pin-label">
              PIN
            </div>
            <PinDots length={pin.length} testId="pin-dots" />
            <Button tone="go" size="huge" disabled={!pinOk || signIn.isPending} onClick={submit}>
              {signIn.isPending ? 'Signing in…' : 'Sign in'}
            </Button>
          </>
        )}

        {problem?.kind === 'message' && (
          <Notice tone={problem.tone} title={problem.title}>
            {problem.text}
          </Notice>
        )}
        {problem?.kind === 'locked' && (
          <Notice tone="warning" big title={`Badge locked until ${localTime(problem.until)}`}>
            {problem.text}
          </Notice>
        )}
      </section>
      <section
        aria-label={step === 'badge' ? 'Badge keypad' : 'PIN keypad'}
        className="portrait:mx-auto portrait:w-full portrait:max-w-[480px]"
      >
        <Keypad onDigit={type} onBackspace={back} />
      </section>
      {scanning && (
        <QrScanner
          what="badge"
          onClose={() => setScanning(false)}
          onResult={(text) => {
            setScanning(false);
            const scanned = badgeFromScan(text);
            if (scanned) {
              setBadge(scanned);
              setStep('pin');
            } else setScanNote('That code is not a badge. Scan your staff badge, or type the number.');
          }}
        />
      )}
    </div>
  );
}
