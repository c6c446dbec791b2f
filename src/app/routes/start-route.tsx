import { Link, Navigate } from 'react-router-dom';
import { useSession } from '@/features/auth/api/get-session';
import { LimitsNotice } from '@/components/ui/limits-notice';

const tile = 'flex min-h-[220px] flex-col justify-end gap-2 rounded-2xl border-2 p-6 active:scale-[0.99]';

export function StartRoute() {
  const session = useSession();
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
          Hangar quick check
        </div>
        <h1 className="text-[64px] font-bold leading-none">Gaugewalk</h1>
      </header>
      <nav className="grid flex-1 content-start gap-5 landscape:grid-cols-3" aria-label="Start">
        <Link to="/kiosk" className={`${tile} border-signal-edge bg-signal-bright text-on-fill`}>
          <span className="text-[44px] font-bold leading-tight">Kiosk</span>
          <span className="text-lead">Check an aircraft: badge, PIN, readings</span>
        </Link>
        <Link to="/board" className={`${tile} border-ink-line bg-ink-soft`}>
          <span className="text-[44px] font-bold leading-tight">Hangar board</span>
          <span className="text-lead text-ink-muted">Every airframe's state, for the big screen</span>
        </Link>
        <Link to="/desk" className={`${tile} border-ink-line bg-ink-soft`}>
          <span className="text-[44px] font-bold leading-tight">Desk sign-in</span>
          <span className="text-lead text-ink-muted">Shift leads and engineering</span>
        </Link>
      </nav>
      <LimitsNotice />
    </div>
  );
}
