import { useTranslation } from 'react-i18next';
import { Link, Navigate, useNavigate, useParams } from 'react-router-dom';
import { AirframePicker } from '@/features/airframes/components/airframe-picker';
import { SendQueuePanel } from '@/features/checks/components/send-queue-panel';
import { RaiseDefectPanel } from '@/features/defects/components/raise-defect-panel';
import { PageShell } from '@/components/ui/page-shell';
import { useReviewQueued } from './kiosk-queue-route';
import { KioskUserActions, useKioskSession } from './kiosk-layout';
import { isPilotOnly } from './acceptance-routes';

// Defects raised here are signed on the kiosk keypad.
const kioskChannel = 'kiosk' as const;
const airframesPath = '/kiosk/airframes';

export function KioskAirframesRoute() {
  const session = useKioskSession();
  const navigate = useNavigate();
  const { id } = useParams();
  const selectedId = id ? Number(id) : null;
  const review = useReviewQueued();
  const { t } = useTranslation('app');
  // Sign-in, a resumed path and a scanned tag all land here; a pilot belongs in the pilot view.
  if (isPilotOnly(session.user.roles))
    return <Navigate to={selectedId === null ? '/pilot' : `/pilot/airframes/${selectedId}`} replace />;
  return (
    <PageShell
      title={t('airframes.title')}
      eyebrow={t('kioskEyebrow', { name: session.kiosk.name })}
      actions={
        <>
          <Link
            to={selectedId === null ? '/kiosk/defects' : `/kiosk/defects/${selectedId}`}
            className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold"
          >
            {t('airframes.techLog')}
          </Link>
          {session.user.roles.includes('shift_lead') && (
            <Link
              to="/kiosk/holds"
              className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold"
            >
              {t('airframes.holdsQueue')}
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
          onOpenResult={(checkId) => void navigate(`/kiosk/checks/${checkId}`)}
        />
      </div>
      <AirframePicker
        selectedId={selectedId}
        onSelect={(airframeId) =>
          void navigate(airframeId === null ? airframesPath : `${airframesPath}/${airframeId}`, {
            replace: true,
          })
        }
        onStart={(airframeId, kind) => void navigate(`/kiosk/airframes/${airframeId}/check/${kind}`)}
        onTag={(token) => void navigate(`/t/${encodeURIComponent(token)}`)}
        selectedExtras={(airframe) => (
          <RaiseDefectPanel
            key={airframe.id}
            airframeId={airframe.id}
            fleetNumber={airframe.fleetNumber}
            channel={kioskChannel}
            maintenance
          />
        )}
      />
    </PageShell>
  );
}
