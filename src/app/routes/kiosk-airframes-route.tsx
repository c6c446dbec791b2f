import { useNavigate, useParams } from 'react-router-dom';
import { AirframePicker } from '../../features/airframes/components/airframe-picker';
import { SendQueuePanel } from '../../features/checks/components/send-queue-panel';
import { PageShell } from '../../components/ui/page-shell';
import { useReviewQueued } from './kiosk-queue-route';
import { KioskUserActions, useKioskSession } from './kiosk-layout';

export function KioskAirframesRoute() {
  const session = useKioskSession();
  const navigate = useNavigate();
  const { id } = useParams();
  const selectedId = id ? Number(id) : null;
  const review = useReviewQueued();
  return (
    <PageShell
      title="Airframes"
      eyebrow={`Kiosk · ${session.kiosk.name}`}
      actions={<KioskUserActions session={session} />}
      showsLimits
    >
      <div className="mb-5 empty:hidden">
        <SendQueuePanel
          signedIn={{ kioskId: session.kiosk.id, badge: session.user.badgeNumber }}
          onReview={review}
          onOpenResult={(checkId) => navigate(`/kiosk/checks/${checkId}`)}
        />
      </div>
      <AirframePicker
        selectedId={selectedId}
        onSelect={(airframeId) =>
          navigate(airframeId === null ? '/kiosk/airframes' : `/kiosk/airframes/${airframeId}`, {
            replace: true,
          })
        }
        onStart={(airframeId, kind) => navigate(`/kiosk/airframes/${airframeId}/check/${kind}`)}
        onTag={(token) => navigate(`/t/${encodeURIComponent(token)}`)}
      />
    </PageShell>
  );
}
