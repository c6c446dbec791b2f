import { useTranslation } from 'react-i18next';
import { Navigate, Outlet, useLocation, useNavigate, useOutletContext } from 'react-router-dom';
import type { SessionInfo, SessionUser } from '@shared/schemas/auth';
import { useSession } from '@/features/auth/api/get-session';
import { useSignOut } from '@/features/auth/api/sign-out';
import { IdleLock } from '@/features/auth/components/idle-lock';
import { QueuedChecks, WaitingToSendButton } from '@/features/checks/components/queued-checks';
import { useQueueSender } from '@/features/checks/model/use-send-queue';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { errorMessage } from '@/lib/api-client';
import { LanguageButton } from '../language-button';
import { rememberWhereLocked } from '../resume-after-lock';

const queuePath = '/kiosk/queue';

export interface KioskSession {
  user: SessionUser;
  kiosk: NonNullable<SessionInfo['kiosk']>;
  signOut: () => void;
}

export const useKioskSession = () => useOutletContext<KioskSession>();

/** Every kiosk screen after sign-in: needs a kiosk-channel session on an enrolled tablet, and locks itself when idle. */
export function KioskLayout() {
  const session = useSession();
  const { t } = useTranslation('app');

  if (session.isPending) return <p className="p-6 text-lead">{t('loading')}</p>;
  if (session.isError) {
    return (
      <div className="flex flex-col items-start gap-5 p-6">
        <Notice tone="warning" title={t('serverUnreachable')}>
          {errorMessage(session.error)}
        </Notice>
        <Button tone="primary" size="large" onClick={() => void session.refetch()}>
          {t('tryAgain')}
        </Button>
        <QueuedChecks signedIn={null} />
      </div>
    );
  }
  const { user, kiosk, channel } = session.data;
  if (!user || !kiosk || channel !== 'kiosk') return <Navigate to="/kiosk" replace />;
  return <SignedInKiosk user={user} kiosk={kiosk} idleSeconds={session.data.idleSeconds} />;
}

function SignedInKiosk({
  user,
  kiosk,
  idleSeconds,
}: {
  user: SessionUser;
  kiosk: KioskSession['kiosk'];
  idleSeconds: number;
}) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();
  // Signed checks waiting on this tablet go out while their owner is signed in, whatever screen is showing.
  useQueueSender(kiosk.id, user.badgeNumber);

  const lock = () => {
    void rememberWhereLocked(kiosk.id, user.badgeNumber, location.pathname + location.search).catch(
      () => undefined,
    );
    signOut.mutate(undefined, {
      onSettled: () => void navigate('/kiosk', { replace: true, state: { locked: true } }),
    });
  };
  const context: KioskSession = {
    user,
    kiosk,
    signOut: () => signOut.mutate(undefined, { onSettled: () => void navigate('/kiosk', { replace: true }) }),
  };
  return (
    <>
      <IdleLock idleSeconds={idleSeconds} onLock={lock} />
      <Outlet context={context} />
    </>
  );
}

export function KioskUserActions({ session }: { session: KioskSession }) {
  const navigate = useNavigate();
  const location = useLocation();
  const { t } = useTranslation('app');
  return (
    <>
      {location.pathname !== queuePath && <WaitingToSendButton onOpen={() => void navigate(queuePath)} />}
      <span className="text-[22px]">
        <span className="text-ink-muted">{t('kioskHeader.signedIn')}</span>
        <strong>{session.user.name}</strong> · {session.user.badgeNumber}
      </span>
      <LanguageButton />
      <Button tone="neutral" onClick={session.signOut}>
        {t('signOut')}
      </Button>
    </>
  );
}
