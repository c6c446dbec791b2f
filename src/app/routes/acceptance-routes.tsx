import { useState } from 'react';
import { Link, Navigate, useNavigate, useParams } from 'react-router-dom';
import { PilotFleetList } from '@/features/acceptance/components/pilot-fleet-list';
import { PilotAirframeView } from '@/features/acceptance/components/pilot-airframe-view';
import { RaiseDefectPanel } from '@/features/defects/components/raise-defect-panel';
import { tagTokenFrom } from '@/features/airframes/components/tag-token';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PageShell } from '@/components/ui/page-shell';
import { QrGlyph } from '@/components/ui/qr-glyph';
import { QrScanner } from '@/components/ui/qr-scanner';
import { KioskUserActions, useKioskSession } from './kiosk-layout';

const backLink =
  'inline-flex min-h-touch items-center self-start rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold';

/** Pilots (and only pilots who are not also mechanics) start here after a kiosk sign-in. */
export const isPilotOnly = (roles: string[]) => roles.includes('pilot') && !roles.includes('mechanic');

export function PilotListRoute() {
  const session = useKioskSession();
  const navigate = useNavigate();
  const [scanning, setScanning] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  if (!session.user.roles.includes('pilot')) return <Navigate to="/kiosk/airframes" replace />;
  return (
    <PageShell
      title="Pick the aircraft"
      eyebrow={`Pilot · ${session.kiosk.name}`}
      actions={<KioskUserActions session={session} />}
      showsLimits
    >
      <div className="flex flex-col gap-5">
        <Button
          tone="primary"
          size="large"
          className="self-start"
          onClick={() => {
            setProblem(null);
            setScanning(true);
          }}
        >
          <QrGlyph /> Scan tag
        </Button>
        {problem && (
          <Notice tone="caution" title="Not an airframe tag">
            {problem}
          </Notice>
        )}
        <PilotFleetList hrefFor={(id) => `/pilot/airframes/${id}`} />
      </div>
      {scanning && (
        <QrScanner
          what="tag"
          onClose={() => setScanning(false)}
          onResult={(text) => {
            setScanning(false);
            const token = tagTokenFrom(text);
            if (token) navigate(`/t/${encodeURIComponent(token)}`);
            else
              setProblem(
                'That QR code is not a Gaugewalk airframe tag. Scan the tag on the airframe, or pick it below.',
              );
          }}
        />
      )}
    </PageShell>
  );
}

export function PilotAirframeRoute() {
  const session = useKioskSession();
  const airframeId = Number(useParams().id);
  if (!session.user.roles.includes('pilot'))
    return <Navigate to={`/kiosk/airframes/${airframeId}`} replace />;
  return (
    <PageShell
      title="Before flight"
      eyebrow={`Pilot · ${session.kiosk.name}`}
      actions={<KioskUserActions session={session} />}
      showsLimits
    >
      <div className="flex flex-col gap-5">
        <Link to="/pilot" className={backLink}>
          All aircraft
        </Link>
        <PilotAirframeView
          airframeId={airframeId}
          actions={(view) => (
            <RaiseDefectPanel
              airframeId={view.airframe.id}
              fleetNumber={view.airframe.fleetNumber}
              channel="kiosk"
            />
          )}
        />
      </div>
    </PageShell>
  );
}
