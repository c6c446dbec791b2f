import { useEffect, useRef, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { onSignedOut } from '@/lib/api-client';
import { touchSession } from '../api/touch-session';

interface IdleLockProps {
  idleSeconds: number;
  onLock: (reason: 'idle' | 'server') => void;
}

const keepAliveEveryMs = 20_000;
const warnSeconds = 15;

/**
 * Locks the kiosk after idleSeconds without a touch, and keeps the server session alive (at most every 20 s)
 * while someone is using the screen. The server enforces the same limit; a 401 from anywhere locks at once.
 */
export function IdleLock({ idleSeconds, onLock }: IdleLockProps) {
  const { t } = useTranslation('auth');
  const lastTouch = useRef(Date.now());
  const lastKeepAlive = useRef(Date.now());
  const lock = useRef(onLock);
  lock.current = onLock;
  const [secondsLeft, setSecondsLeft] = useState(idleSeconds);

  useEffect(() => {
    let locked = false;
    const fire = (reason: 'idle' | 'server') => {
      if (locked) return;
      locked = true;
      lock.current(reason);
    };
    const activity = () => {
      const now = Date.now();
      lastTouch.current = now;
      setSecondsLeft(idleSeconds);
      if (now - lastKeepAlive.current >= keepAliveEveryMs) {
        lastKeepAlive.current = now;
        touchSession().catch(() => undefined);
      }
    };
    const events = ['pointerdown', 'keydown', 'wheel'] as const;
    for (const name of events) window.addEventListener(name, activity, { capture: true, passive: true });
    const timer = window.setInterval(() => {
      // A margin of 2 s so the page locks before the server refuses the next request.
      const left = Math.ceil(idleSeconds - 2 - (Date.now() - lastTouch.current) / 1000);
      setSecondsLeft(left);
      if (left <= 0) fire('idle');
    }, 1000);
    const unsubscribe = onSignedOut(() => fire('server'));
    return () => {
      for (const name of events) window.removeEventListener(name, activity, { capture: true });
      window.clearInterval(timer);
      unsubscribe();
    };
  }, [idleSeconds]);

  if (secondsLeft > warnSeconds) return null;
  return (
    <div
      role="alert"
      className="fixed inset-x-0 bottom-0 z-40 flex items-center justify-center gap-4 border-t-4 border-caution-edge bg-ink-soft px-6 py-5 text-[28px] font-semibold"
    >
      {t('idleLock.warning', { seconds: Math.max(0, secondsLeft) })}
    </div>
  );
}
