import i18next from 'i18next';
import { useEffect, useId, useRef, useState } from 'react';
import { Button } from './button';
import { Notice } from './notice';
import { useTranslation } from 'react-i18next';

interface QrScannerProps {
  /** What is being scanned, for the heading ("badge", "tag"). */
  what: string;
  onResult: (text: string) => void;
  onClose: () => void;
}

type Phase = { kind: 'starting' } | { kind: 'scanning' } | { kind: 'failed'; message: string };

function cameraProblem(error: unknown): string {
  const text = error instanceof Error ? `${error.name} ${error.message}` : String(error);
  if (/NotAllowed|Permission|denied/i.test(text)) {
    return i18next.t('scanner.notAllowed', { ns: 'common' });
  }
  if (/NotFound|no camera|Requested device not found|OverconstrainedError/i.test(text)) {
    return i18next.t('scanner.noCamera', { ns: 'common' });
  }
  if (!window.isSecureContext) return i18next.t('scanner.insecure', { ns: 'common' });
  return i18next.t('scanner.failed', { ns: 'common' });
}

/** Full-screen camera view that reads one QR code. html5-qrcode is loaded only when a scan is asked for. */
export function QrScanner({ what, onResult, onClose }: QrScannerProps) {
  const { t } = useTranslation('common');
  const regionId = `qr-${useId().replace(/[^a-zA-Z0-9]/g, '')}`;
  const [phase, setPhase] = useState<Phase>({ kind: 'starting' });
  const result = useRef(onResult);
  result.current = onResult;

  useEffect(() => {
    let cancelled = false;
    let stop: (() => Promise<void>) | null = null;
    void (async () => {
      try {
        if (!navigator.mediaDevices?.getUserMedia) throw new Error('NotFound: no camera API');
        const { Html5Qrcode } = await import('html5-qrcode');
        if (cancelled) return;
        const scanner = new Html5Qrcode(regionId, { verbose: false });
        let done = false;
        await scanner.start(
          { facingMode: 'environment' },
          { fps: 10, qrbox: { width: 280, height: 280 } },
          (text) => {
            if (done) return;
            done = true;
            result.current(text);
          },
          () => undefined,
        );
        stop = async () => {
          if (scanner.isScanning) await scanner.stop();
          scanner.clear();
        };
        if (cancelled) await stop();
        else setPhase({ kind: 'scanning' });
      } catch (error) {
        if (!cancelled) setPhase({ kind: 'failed', message: cameraProblem(error) });
      }
    })();
    return () => {
      cancelled = true;
      void stop?.().catch(() => undefined);
    };
  }, [regionId]);

  return (
    <div
      role="dialog"
      aria-modal="true"
      aria-label={t('scanner.scan', { what })}
      className="fixed inset-0 z-50 flex flex-col gap-4 bg-ink/95 p-6"
    >
      <div className="flex items-center gap-4">
        <h2 className="mr-auto text-[34px] font-bold">{t('scanner.scan', { what })}</h2>
        <Button tone="neutral" size="large" onClick={onClose}>
          {t('scanner.useKeypad')}
        </Button>
      </div>
      {phase.kind === 'starting' && <p className="text-lead text-ink-muted">{t('scanner.starting')}</p>}
      {phase.kind === 'scanning' && <p className="text-lead">{t('scanner.hold', { what })}</p>}
      {phase.kind === 'failed' && (
        <Notice tone="caution" title={t('scanner.unavailable')} big>
          {phase.message}
        </Notice>
      )}
      <div id={regionId} className="mx-auto w-full max-w-[640px] overflow-hidden rounded-xl bg-black" />
    </div>
  );
}
