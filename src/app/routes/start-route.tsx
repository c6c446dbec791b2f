import { useTranslation } from 'react-i18next';
import { Link, Navigate } from 'react-router-dom';
import { useSession } from '@/features/auth/api/get-session';
import { LimitsNotice } from '@/components/ui/limits-notice';

// The product's name, the same in every language.
const productName = 'Gaugewalk';

const tile = 'flex min-h-[220px] flex-col justify-end gap-2 rounded-2xl border-2 p-6 active:scale-[0.99]';

export function StartRoute() {
  const session = useSession();
  const { t } = useTranslation('app');
  if (session.data?.kiosk)
    return (
      <Navigate
        to={session.data.channel === 'kiosk' && session.data.user ? '/kiosk/airframes' : '/kiosk'}
        replace
      />
    );
  return (
    <div className="flex min-h-dvh flex-col gap-8 bg-ink p-8 text-paper">
      <header>
        <div className="text-[22px] font-semibold uppercase tracking-[0.2em] text-ink-muted">
          {t('start.eyebrow')}
        </div>
        <h1 className="text-[64px] font-bold leading-none">{productName}</h1>
      </header>
      <nav className="grid flex-1 content-start gap-5 landscape:grid-cols-3" aria-label={t('start.navLabel')}>
        <Link to="/kiosk" className={`${tile} border-signal-edge bg-signal-bright text-on-fill`}>
          <span className="text-[44px] font-bold leading-tight">{t('start.kiosk')}</span>
          <span className="text-lead">{t('start.kioskWhat')}</span>
        </Link>
        <Link to="/board" className={`${tile} border-ink-line bg-ink-soft`}>
          <span className="text-[44px] font-bold leading-tight">{t('hangarBoard')}</span>
          <span className="text-lead text-ink-muted">{t('start.boardWhat')}</span>
        </Link>
        <Link to="/desk" className={`${tile} border-ink-line bg-ink-soft`}>
          <span className="text-[44px] font-bold leading-tight">{t('deskSignIn')}</span>
          <span className="text-lead text-ink-muted">{t('leadsAndEngineering')}</span>
        </Link>
      </nav>
      <LimitsNotice />
    </div>
  );
}
