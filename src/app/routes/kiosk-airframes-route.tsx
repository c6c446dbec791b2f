import { useNavigate, useParams } from 'react-router-dom';
import { AirframePicker } from '../../features/airframes/components/airframe-picker';
import { PageShell } from '../../components/ui/page-shell';
import { KioskUserActions, useKioskSession } from './kiosk-layout';

export function KioskAirframesRoute() {
  const session = useKioskSession();
  const navigate = useNavigate();
  const { id } = useParams();
  const selectedId = id ? Number(id) : null;
  return (
    <PageShell title="Airframes" eyebrow={`Kiosk · ${session.kiosk.name}`} actions={<KioskUserActions session={session} />} showsLimits>
      <AirframePicker
        selectedId={selectedId}
        onSelect={(airframeId) => navigate(airframeId === null ? '/kiosk/airframes' : `/kiosk/airframes/${airframeId}`, { replace: true })}
        onStart={(airframeId, kind) => navigate(`/kiosk/airframes/${airframeId}/check/${kind}`)}
        onTag={(token) => navigate(`/t/${encodeURIComponent(token)}`)}
      />
    </PageShell>
  );
}
