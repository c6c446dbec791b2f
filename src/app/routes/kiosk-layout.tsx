import { Navigate, Outlet, useLocation, useNavigate, useOutletContext } from 'react-router-dom';
import type { SessionInfo, SessionUser } from '../../../shared/schemas/auth';
import { useSession } from '../../features/session/api/get-session';
import { useSignOut } from '../../features/session/api/sign-out';
import { IdleLock } from '../../features/session/components/idle-lock';
import { Button } from '../../components/ui/button';
import { Notice } from '../../components/ui/notice';
import { errorMessage } from '../../lib/api-client';
import { rememberWhereLocked } from '../resume-after-lock';

export interface KioskSession {
  user: SessionUser;
  kiosk: NonNullable<SessionInfo['kiosk']>;
  signOut: () => void;
}

export const useKioskSession = () => useOutletContext<KioskSession>();

/** Every kiosk screen after sign-in: needs a kiosk-channel session on an enrolled tablet, and locks itself when idle. */
export function KioskLayout() {
  const session = useSession();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();

  if (session.isPending) return <p className="p-6 text-lead">Loading…</p>;
  if (session.isError) {
    return (
      <div className="p-6">
        <Notice tone="warning" title="The server cannot be reached">{errorMessage(session.error)}</Notice>
      </div>
    );
  }
  const { user, kiosk, channel } = session.data;
  if (!user || !kiosk || channel !== 'kiosk') return <Navigate to="/kiosk" replace />;

  const lock = () => {
    rememberWhereLocked(kiosk.id, user.badgeNumber, location.pathname + location.search);
    signOut.mutate(undefined, { onSettled: () => navigate('/kiosk', { replace: true, state: { locked: true } }) });
  };
  const context: KioskSession = {
    user,
    kiosk,
    signOut: () => signOut.mutate(undefined, { onSettled: () => navigate('/kiosk', { replace: true }) }),
  };
  return (
    <>
      <IdleLock idleSeconds={session.data.idleSeconds} onLock={lock} />
      <Outlet context={context} />
    </>
  );
}

export function KioskUserActions({ session }: { session: KioskSession }) {
  return (
    <>
      <span className="text-[22px]">
        <span className="text-ink-muted">Signed in: </span>
        <strong>{session.user.name}</strong> · {session.user.badgeNumber}
      </span>
      <Button tone="neutral" onClick={session.signOut}>
        Sign out
      </Button>
    </>
  );
}
