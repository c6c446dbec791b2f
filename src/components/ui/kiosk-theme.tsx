import { useTranslation } from 'react-i18next';
import { useLayoutEffect, useSyncExternalStore } from 'react';
import { Button } from './button';

export type KioskTheme = 'night' | 'daylight';

// Chosen per tablet, like the board's theme: a hangar tablet by the open door wants daylight, one inside night.
const themeKey = 'gw.kiosk.theme';
const listeners = new Set<() => void>();

function readTheme(): KioskTheme {
  try {
    return localStorage.getItem(themeKey) === 'daylight' ? 'daylight' : 'night';
  } catch {
    return 'night';
  }
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  window.addEventListener('storage', listener);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', listener);
  };
}

export function useKioskTheme(): [KioskTheme, (theme: KioskTheme) => void] {
  const theme = useSyncExternalStore(subscribe, readTheme, () => 'night' as const);
  const choose = (next: KioskTheme) => {
    try {
      localStorage.setItem(themeKey, next);
    } catch {
      // Storage blocked: the choice lasts until the page is reloaded.
    }
    for (const listener of listeners) listener();
  };
  return [theme, choose];
}

/** Puts the tablet's theme on the page (`data-theme` on <html>, read by the colour variables in index.css). */
export function useApplyKioskTheme(theme: KioskTheme) {
  useLayoutEffect(() => {
    const root = document.documentElement;
    root.dataset.theme = theme;
    return () => {
      delete root.dataset.theme;
    };
  }, [theme]);
}

/** One glove-sized button in the kiosk's header; its word says what a tap does. */
export function ThemeSwitch({
  theme,
  onChoose,
}: {
  theme: KioskTheme;
  onChoose: (theme: KioskTheme) => void;
}) {
  const { t } = useTranslation('common');
  const next: KioskTheme = theme === 'night' ? 'daylight' : 'night';
  return (
    <Button tone="neutral" data-testid="theme-switch" data-theme-now={theme} onClick={() => onChoose(next)}>
      <svg width="30" height="30" viewBox="0 0 32 32" aria-hidden className="shrink-0">
        {next === 'daylight' ? (
          <g stroke="currentColor" strokeWidth="3" strokeLinecap="round" fill="none">
            <circle cx="16" cy="16" r="6" fill="currentColor" />
            <path d="M16 2v4M16 26v4M2 16h4M26 16h4M6 6l3 3M23 23l3 3M6 26l3-3M23 9l3-3" />
          </g>
        ) : (
          <path d="M21 3a12 12 0 1 0 8 17A10 10 0 0 1 21 3Z" fill="currentColor" />
        )}
      </svg>
      {t(next === 'daylight' ? 'theme.daylight' : 'theme.night')}
    </Button>
  );
}
