import { useTranslation } from 'react-i18next';
import { Link, Navigate, useParams } from 'react-router-dom';
import { useSession } from '@/features/auth/api/get-session';
import { useTag } from '@/features/airframes/api/get-tag';
import { PageShell } from '@/components/ui/page-shell';
import { Notice } from '@/components/ui/notice';
import { kioskLinkClass } from '@/components/ui/kiosk-link';
import { ApiRequestError, errorMessage } from '@/lib/api-client';

/** A scanned airframe tag: resolve it, sign in first when needed, then open the airframe. */
export function TagRoute() {
  const { token = '' } = useParams();
  const session = useSession();
  const canLook = Boolean(session.data?.kiosk || session.data?.user);
  const tag = useTag(token, canLook);
  const { t } = useTranslation('app');

  if (session.isPending || (canLook && tag.isPending))
    return <p className="p-6 text-lead">{t('tag.reading')}</p>;
  if (!canLook) {
    return (
      <PageShell title={t('tag.title')}>
        <div className="flex max-w-[900px] flex-col gap-5">
          <Notice tone="caution" big title={t('tag.signInFirst')}>
            {t('tag.signInFirstText')}
          </Notice>
          <div className="flex gap-4">
            <Link className={kioskLinkClass} to="/kiosk">
              {t('kioskSignIn.title')}
            </Link>
            <Link className={kioskLinkClass} to="/desk">
              {t('deskSignIn')}
            </Link>
          </div>
        </div>
      </PageShell>
    );
  }
  if (tag.isError) {
    const code = tag.error instanceof ApiRequestError ? tag.error.code : null;
    const title =
      code === 'tag_revoked'
        ? t('tag.revoked')
        : code === 'tag_unknown'
          ? t('tag.unknown')
          : t('tag.unreadable');
    return (
      <PageShell title={t('tag.title')}>
        <div className="flex max-w-[1000px] flex-col gap-5">
          <Notice tone="warning" big title={title}>
            {errorMessage(tag.error)}
          </Notice>
          <Link className={kioskLinkClass} to={session.data?.kiosk ? '/kiosk/airframes' : '/board'}>
            {t('tag.pickFromList')}
          </Link>
        </div>
      </PageShell>
    );
  }
  if (!tag.data) return <p className="p-6 text-lead">{t('tag.reading')}</p>;
  const target = `/kiosk/airframes/${tag.data.airframeId}`;
  const data = session.data;
  if (data?.kiosk && data.user && data.channel === 'kiosk') return <Navigate to={target} replace />;
  if (data?.kiosk) return <Navigate to={`/kiosk?next=${encodeURIComponent(target)}`} replace />;
  return (
    <PageShell title={t('tag.airframe', { fleetNumber: tag.data.fleetNumber })}>
      <Notice tone="info" big title={t('tag.thisIs', { fleetNumber: tag.data.fleetNumber })}>
        {t('tag.recordedOnKiosk')}
      </Notice>
      <Link className={`${kioskLinkClass} mt-5 self-start`} to="/board">
        {t('hangarBoard')}
      </Link>
    </PageShell>
  );
}
