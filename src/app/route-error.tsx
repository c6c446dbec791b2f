import { useEffect } from 'react';
import { useTranslation } from 'react-i18next';
import type { FallbackProps } from 'react-error-boundary';

/**
 * Last resort: a broken screen still tells the mechanic that readings on the tablet are kept. The error's own text
 * (a browser's "Failed to fetch dynamically imported module: https://…", a stack's words) goes to the console, not
 * to the screen: people read words, never codes or addresses.
 */
export function RouteError({ error }: FallbackProps) {
  const { t } = useTranslation('app');
  useEffect(() => console.error(error), [error]);
  return (
    <div role="alert" className="flex min-h-dvh flex-col items-start gap-5 bg-ink p-8 text-paper">
      <h1 className="text-[40px] font-bold">{t('routeError.title')}</h1>
      <p className="text-lead">
        {t('routeError.body', {
          message: t('routeError.somethingWentWrong'),
        })}
      </p>
      <button
        type="button"
        onClick={() => window.location.reload()}
        className="min-h-touch rounded-xl border-2 border-ink-line bg-ink-raised px-6 text-[24px] font-semibold"
      >
        {t('routeError.reload')}
      </button>
    </div>
  );
}
