import { useState } from 'react';
import type { TFunction } from 'i18next';
import { useTranslation } from 'react-i18next';
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
const steps = { badge: 'badge', pin: 'pin' } as const;

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

/** The server's own message is shown as it came; the title above it is this screen's, in the tablet's language. */
function problemFrom(error: unknown, t: TFunction<'auth'>): Problem {
  if (error instanceof ApiRequestError) {
    if (error.code === 'badge_locked' && typeof error.body.lockedUntil === 'string') {
      return { kind: 'locked', until: new Date(error.body.lockedUntil), text: error.message };
    }
    if (error.code === 'kiosk_not_enrolled') {
      return {
        kind: 'message',
        tone: 'warning',
        title: t('problems.notEnrolledTitle'),
        text: t('problems.notEnrolledText', { message: error.message }),
      };
    }
    // The words say the badge and PIN do not match; the title does not say it twice.
    if (error.code === 'wrong_pin')
      return { kind: 'message', tone: 'caution', title: t('notSignedIn'), text: error.message };
    if (error.code === 'too_many_attempts')
      return { kind: 'message', tone: 'caution', title: t('problems.tooManyAttempts'), text: error.message };
  }
  return { kind: 'message', tone: 'warning', title: t('notSignedIn'), text: errorMessage(error) };
}

export function KioskSignInPanel({ onSignedIn }: KioskSignInPanelProps) {
  const [step, setStep] = useState<'badge' | 'pin'>('badge');
  const [badge, setBadge] = useState('');
  const [pin, setPin] = useState('');
  const [scanning, setScanning] = useState(false);
  const [scanNote, setScanNote] = useState<string | null>(null);
  const [problem, setProblem] = useState<Problem | null>(null);
  const signIn = useKioskSignIn();
  const { t } = useTranslation('auth');

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
          setProblem(problemFrom(error, t));
        },
      },
    );
  };

  return (
    <div className="grid flex-1 gap-6 landscape:grid-cols-[1fr_minmax(360px,420px)] portrait:grid-cols-1">
      <section className="flex flex-col gap-5">
        <ol className="flex gap-3 text-[22px] font-semibold" aria-label={t('kiosk.steps')}>
          <li
            className={`rounded-lg px-4 py-2 ${step === 'badge' ? 'bg-signal-bright text-on-fill' : 'bg-ink-raised text-paper'}`}
          >
            {t('kiosk.stepBadge')}
          </li>
          <li
            className={`rounded-lg px-4 py-2 ${step === 'pin' ? 'bg-signal-bright text-on-fill' : 'bg-ink-raised text-paper'}`}
          >
            {t('kiosk.stepPin')}
          </li>
        </ol>

        {step === 'badge' ? (
          <>
            <label className="text-lead text-ink-muted" htmlFor="badge-display">
              {t('badgeNumber')}
            </label>
            <output
              id="badge-display"
              data-testid="badge-display"
              className="tabular flex min-h-[112px] items-center rounded-xl border-2 border-ink-line bg-ink-soft px-6 text-[64px] font-bold tracking-[0.15em]"
            >
              {badge || (
                <span className="text-[30px] font-normal tracking-normal text-ink-muted">
                  {t('kiosk.typeOrScan')}
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
                <QrGlyph /> {t('kiosk.scanBadge')}
              </Button>
              <Button
                tone="primary"
                size="large"
                className="flex-1"
                disabled={!badgeOk}
                onClick={() => {
                  setProblem(null);
                  setStep(steps.pin);
                }}
              >
                {t('kiosk.nextPin')}
              </Button>
            </div>
            {scanNote && <Notice tone="caution">{scanNote}</Notice>}
          </>
        ) : (
          <>
            <div className="flex items-center gap-4">
              <div className="mr-auto">
                <div className="text-lead text-ink-muted">{t('kiosk.badge')}</div>
                <div data-testid="badge-confirmed" className="tabular text-[44px] font-bold">
                  {badge}
                </div>
              </div>
              <Button
                tone="quiet"
                onClick={() => {
                  setPin('');
                  setStep(steps.badge);
                  setProblem(null);
                }}
              >
                {t('kiosk.changeBadge')}
              </Button>
            </div>
            <div className="text-lead text-ink-muted" id="pin-label">
              {t('kiosk.pin')}
            </div>
            <PinDots length={pin.length} testId="pin-dots" />
            {/* A refused PIN is cleared, so Sign in could not be pressed anyway: the refusal takes its place until
                the next digit, and the keypad stays in view on an upright tablet (it was pushed below the screen). */}
            {problem?.kind === 'message' ? (
              <Notice tone={problem.tone} title={problem.title}>
                {problem.text}
              </Notice>
            ) : problem?.kind === 'locked' ? (
              <Notice
                tone="warning"
                big
                title={t('problems.lockedUntil', { until: localTime(problem.until) })}
              >
                {problem.text}
              </Notice>
            ) : (
              <Button tone="go" size="huge" disabled={!pinOk || signIn.isPending} onClick={submit}>
                {signIn.isPending ? t('signingIn') : t('kiosk.signIn')}
              </Button>
            )}
          </>
        )}
      </section>
      <section
        aria-label={step === 'badge' ? t('kiosk.badgeKeypad') : t('kiosk.pinKeypad')}
        className="portrait:mx-auto portrait:w-full portrait:max-w-[480px]"
      >
        <Keypad onDigit={type} onBackspace={back} />
      </section>
      {scanning && (
        <QrScanner
          what={t('kiosk.scanWhat')}
          onClose={() => setScanning(false)}
          onResult={(text) => {
            setScanning(false);
            const scanned = badgeFromScan(text);
            if (scanned) {
              setBadge(scanned);
              setStep(steps.pin);
            } else setScanNote(t('kiosk.notABadge'));
          }}
        />
      )}
    </div>
  );
}
