import { useRef } from 'react';
import { Outlet, useLocation } from 'react-router-dom';
import { useRegisterSW } from 'virtual:pwa-register/react';
import { useReservedBottom } from '@/components/ui/bottom-bar';

/** Where a reload could cut into work: a check being filled in. Its draft is kept, but the mechanic's place is not. */
export const isMidCheck = (pathname: string) => /^\/kiosk\/airframes\/[^/]+\/check\//.test(pathname);

/**
 * The service worker keeps the app's screens, fonts and icons so an enrolled tablet opens with no network. A new
 * version waits: it is offered only where a reload cuts into nothing (never on a check card) and only when tapped.
 */
export function AppFrame() {
  const { pathname } = useLocation();
  const {
    needRefresh: [needRefresh],
    updateServiceWorker,
  } = useRegisterSW();
  return (
    <>
      <Outlet />
      {needRefresh && !isMidCheck(pathname) && <UpdateBar onUpdate={() => void updateServiceWorker(true)} />}
    </>
  );
}

/** Pinned to the bottom edge; the page keeps room for it so no key of a pad sits under it. */
function UpdateBar({ onUpdate }: { onUpdate: () => void }) {
  const bar = useRef<HTMLDivElement>(null);
  useReservedBottom(bar, true);
  return (
    <div
      ref={bar}
      role="status"
      data-testid="update-offer"
      className="fixed inset-x-0 bottom-0 z-50 flex flex-wrap items-center gap-4 border-t-4 border-signal-edge bg-ink-raised px-6 py-3 text-[24px] text-paper"
    >
      A new version of Gaugewalk is ready. Nothing you entered is lost by updating.
      <button
        type="button"
        className="ml-auto min-h-touch min-w-touch rounded-xl bg-signal-bright px-6 text-[24px] font-bold text-on-fill"
        onClick={onUpdate}
      >
        Update now
      </button>
    </div>
  );
}
