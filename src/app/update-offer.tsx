import { useTranslation } from 'react-i18next';
import { Outlet, useLocation } from 'react-router-dom';
import { useRegisterSW } from 'virtual:pwa-register/react';

/** Where a reload could cut into work: a check being filled in. Its draft is kept, but the mechanic's place is not. */
export const isMidCheck = (pathname: string) => /^\/kiosk\/airframes\/[^/]+\/check\//.test(pathname);

/**
 * The service worker keeps the app's screens, fonts and icons so an enrolled tablet opens with no network. A new
 * version waits: it is offered only where a reload cuts into nothing (never on a check card) and only when tapped.
 */
export function AppFrame() {
  const { pathname } = useLocation();
  const { t } = useTranslation('app');
  const {
    needRefresh: [needRefresh],
    updateServiceWorker,
  } = useRegisterSW();
  return (
    <>
      <Outlet />
      {needRefresh && !isMidCheck(pathname) && (
        <div
          role="status"
          data-testid="update-offer"
          className="fixed inset-x-0 bottom-0 z-50 flex flex-wrap items-center gap-4 border-t-4 border-signal-bright bg-ink-raised px-6 py-3 text-[24px] text-paper"
        >
          {t('updateOffer.text')}
          <button
            type="button"
            className="ml-auto min-h-touch min-w-touch rounded-xl bg-signal-bright px-6 text-[24px] font-bold text-ink"
            onClick={() => void updateServiceWorker(true)}
          >
            {t('updateOffer.update')}
          </button>
        </div>
      )}
    </>
  );
}
