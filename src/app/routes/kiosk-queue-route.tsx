import { useTranslation } from 'react-i18next';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { checkCardQueryOptions } from '@/features/checks/api/get-check-card';
import { SendQueuePanel } from '@/features/checks/components/send-queue-panel';
import { reopenForReview, type QueuedCheck } from '@/features/checks/model/send-queue';
import { useSendQueue } from '@/features/checks/model/use-send-queue';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PageShell } from '@/components/ui/page-shell';
import { KioskUserActions, useKioskSession } from './kiosk-layout';

/** Opens a refused check again at its review step, against the limits in force now. */
const airframesPath = '/kiosk/airframes';

export function useReviewQueued() {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  return (item: QueuedCheck) => {
    void reopenForReview(item).then(() => {
      void queryClient.invalidateQueries({
        queryKey: checkCardQueryOptions(item.submission.airframeId, item.kind).queryKey,
      });
      void navigate(`/kiosk/airframes/${item.submission.airframeId}/check/${item.kind}`, {
        state: { notice: item.refused?.message ?? null },
      });
    });
  };
}

export function KioskQueueRoute() {
  const session = useKioskSession();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const queue = useSendQueue();
  const review = useReviewQueued();
  const { t } = useTranslation('app');
  const justSigned = params.get('signed');
  const stillWaiting = justSigned !== null && queue.items.some((item) => item.id === justSigned);
  const signedIn = { kioskId: session.kiosk.id, badge: session.user.badgeNumber };
  return (
    <PageShell
      title={t('queue.title')}
      eyebrow={t('kioskEyebrow', { name: session.kiosk.name })}
      actions={<KioskUserActions session={session} />}
    >
      <div className="flex flex-col gap-5">
        {stillWaiting && (
          <Notice tone="caution" big title={t('queue.notSentTitle')}>
            {t('queue.notSentText')}
          </Notice>
        )}
        <SendQueuePanel
          signedIn={signedIn}
          onReview={review}
          onOpenResult={(id) => void navigate(`/kiosk/checks/${id}`)}
        />
        {queue.loaded && queue.items.length === 0 && <p className="text-lead">{t('queue.nothingWaiting')}</p>}
        <Button tone="primary" size="large" onClick={() => void navigate(airframesPath)}>
          {t('backToAirframes')}
        </Button>
      </div>
    </PageShell>
  );
}
