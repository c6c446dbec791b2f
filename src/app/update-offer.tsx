import { useEffect, useState } from 'react';
import { Outlet, useLocation } from 'react-router-dom';

/** Where a reload could cut into work: a check being filled in. Its draft is kept, but the mechanic's place is not. */
export const isMidCheck = (pathname: string) => /^\/kiosk\/airframes\/[^/]+\/check\//.test(pathname);

/**
 * Registers the service worker once the page has loaded (so it never competes with the first screen) and returns
 * a waiting new version, if any. A first install is not offered: nothing older is running. The worker Workbox
 * builds takes over when it is sent SKIP_WAITING; the page then reloads on the change of controller. Done by hand
 * rather than with workbox-window, which was one more script (3 KB) on every first screen.
 */
function useWaitingWorker(): ServiceWorker | null {
  const [waiting, setWaiting] = useState<ServiceWorker | null>(null);
  useEffect(() => {
    if (!import.meta.env.PROD || !('serviceWorker' in navigator)) return;
    let live = true;
    const offer = (registration: ServiceWorkerRegistration) => {
      if (live && registration.waiting && navigator.serviceWorker.controller)
        setWaiting(registration.waiting);
    };
    const register = () =>
      navigator.serviceWorker
        .register('/sw.js', { scope: '/' })
        .then((registration) => {
          offer(registration);
          registration.addEventListener('updatefound', () => {
            const installing = registration.installing;
            installing?.addEventListener('statechange', () => {
              if (installing.state === 'installed') offer(registration);
            });
          });
        })
        .catch(() => {
          // No worker (a private window, an old browser): the app works online as before.
        });
    if (document.readyState === 'complete') void register();
    else window.addEventListener('load', () => void register(), { once: true });
    return () => {
      live = false;
    };
  }, []);
  return waiting;
}

function takeOver(worker: ServiceWorker) {
  navigator.serviceWorker.addEventListener('controllerchange', () => window.location.reload(), {
    once: true,
  });
  worker.postMessage({ type: 'SKIP_WAITING' });
}

/**
 * The service worker keeps the app's screens, fonts and icons so an enrolled tablet opens with no network. A new
 * version waits: it is offered only where a reload cuts into nothing (never on a check card) and only when tapped.
 */
export function AppFrame() {
  const { pathname } = useLocation();
  const waiting = useWaitingWorker();
  return (
    <>
      <Outlet />
      {waiting && !isMidCheck(pathname) && (
        <div
          role="status"
          data-testid="update-offer"
          className="fixed inset-x-0 bottom-0 z-50 flex flex-wrap items-center gap-4 border-t-4 border-signal-bright bg-ink-raised px-6 py-3 text-[24px] text-paper"
        >
          A new version of Gaugewalk is ready. Nothing you entered is lost by updating.
          <button
            type="button"
            className="ml-auto min-h-touch min-w-touch rounded-xl bg-signal-bright px-6 text-[24px] font-bold text-ink"
            onClick={() => takeOver(waiting)}
          >
            Update now
          </button>
        </div>
      )}
    </>
  );
}
