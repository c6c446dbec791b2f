import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Link, Navigate, useLocation, useNavigate, useSearchParams } from 'react-router-dom';
import { useSession } from '@/features/auth/api/get-session';
import { KioskSignInPanel } from '@/features/auth/components/kiosk-sign-in-panel';
import { QueuedChecks } from '@/features/checks/components/queued-checks';
import { PageShell } from '@/components/ui/page-shell';
import { Notice } from '@/components/ui/notice';
import { KioskLink } from '@/components/ui/kiosk-link';
import { errorMessage } from '@/lib/api-client';
import { LanguageButton } from '../language-button';
import { safeNext, takeResumePath } from '../resume-after-lock';
import { kioskWork } from './kiosk-work';

const airframesPath = '/kiosk/airframes';

let warmed = false;
function warmKioskWork() {
  if (warmed) return;
  warmed = true;
  void kioskWork().catch(() => {
    // Offline: the route loads it again when it is needed.
    warmed = false;
  });
}

export function KioskSignInRoute() {
  const session = useSession();
  const { t } = useTranslation('app');
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const location = useLocation();
  const locked = (location.state as { locked?: boolean } | null)?.locked === true;
  const next = safeNext(params.get('next'));
  // While the tablet looks up where this badge was when it locked, the signed-in redirect below waits for it.
  const [resuming, setResuming] = useState(false);

  if (session.isPending) return <p className="p-6 text-lead">{t('loading')}</p>;
  if (session.isError) {
    return (
      <PageShell title={t('kioskSignIn.title')}>
        <Notice tone="warning" title={t('serverUnreachable')}>
          {errorMessage(session.error)}
        </Notice>
      </PageShell>
    );
  }
  const { kiosk, user, channel } = session.data;
  if (kiosk && user && channel === 'kiosk' && !resuming)
    return <Navigate to={next ?? '/kiosk/airframes'} replace />;

  if (!kiosk) {
    return (
      <PageShell title={t('kioskSignIn.title')} eyebrow={t('kioskSignIn.notEnrolledEyebrow')}>
        <div className="flex max-w-[900px] flex-col gap-5">
          <Notice tone="warning" big title={t('kioskSignIn.notEnrolledTitle')}>
            {t('kioskSignIn.notEnrolledText')}
          </Notice>
          <div className="flex flex-wrap gap-4">
            <KioskLink to="/desk">{t('deskSignIn')}</KioskLink>
            <KioskLink to="/">{t('backToStart')}</KioskLink>
          </div>
        </div>
      </PageShell>
    );
  }

  return (
    <PageShell
      title={t('kioskSignIn.signIn')}
      eyebrow={t('kioskEyebrow', { name: kiosk.name })}
      actions={
        <>
          <LanguageButton />
          <Link
            to="/board"
            className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold"
          >
            {t('hangarBoard')}
          </Link>
        </>
      }
    >
      {locked && (
        <div className="mb-4">
          <Notice tone="info" title={t('kioskSignIn.lockedTitle')}>
            {t('kioskSignIn.lockedText')}
          </Notice>
        </div>
      )}
      <div className="mb-4 empty:hidden">
        <QueuedChecks signedIn={null} />
      </div>
      {/* The first touch or key starts fetching the screens that follow sign-in. */}
      <div onPointerDownCapture={warmKioskWork} onKeyDownCapture={warmKioskWork}>
        <KioskSignInPanel
          onSignedIn={(signedIn) => {
            setResuming(true);
            const resume =
              signedIn.kiosk && signedIn.user
                ? takeResumePath(signedIn.kiosk.id, signedIn.user.badgeNumber)
                : Promise.resolve(null);
            void resume.then((path) => navigate(next ?? path ?? airframesPath, { replace: true }));
          }}
        />
      </div>
    </PageShell>
  );
}
