import { Link, Navigate, useNavigate, useParams } from 'react-router-dom';
import { AirframePicker } from '@/features/airframes/components/airframe-picker';
import { SendQueuePanel } from '@/features/checks/components/send-queue-panel';
import { RaiseDefectPanel } from '@/features/defects/components/raise-defect-panel';
import { PageShell } from '@/components/ui/page-shell';
import { useReviewQueued } from './kiosk-queue-route';
import { KioskUserActions, useKioskSession } from './kiosk-layout';
import { isPilotOnly } from './acceptance-routes';

export function KioskAirframesRoute() {
  const session = useKioskSession();
  const navigate = useNavigate();
  const { id } = useParams();
  const selectedId = id ? Number(id) : null;
  const review = useReviewQueued();
  // Sign-in, a resumed path and a scanned tag all land here; a pilot belongs in the pilot view.
  if (isPilotOnly(session.user.roles))
    return <Navigate to={selectedId === null ? '/pilot' : `/pilot/airframes/${selectedId}`} replace />;
  return (
    <PageShell
      title="Airframes"
      eyebrow={`Kiosk · ${session.kiosk.name}`}
      actions={
        <>
          <Link
            to={selectedId === null ? '/kiosk/defects' : `/kiosk/defects/${selectedId}`}
            className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold"
          >
            Tech log
          </Link>
          {session.user.roles.includes('shift_lead') && (
            <Link
              to="/kiosk/holds"
              className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold"
            >
              Holds queue
            </Link>
          )}
          <KioskUserActions session={session} />
        </>
      }
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
        selectedExtras={(airframe) => (
          <RaiseDefectPanel
            key={airframe.id}
            airframeId={airframe.id}
            fleetNumber={airframe.fleetNumber}
            channel="kiosk"
            maintenance
          />
        )}
      />
    </PageShell>
  );
}
