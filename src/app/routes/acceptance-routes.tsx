import { Link, Navigate, useNavigate, useParams } from 'react-router-dom';
import { PilotFleetList } from '@/features/acceptance/components/pilot-fleet-list';
import { PilotAirframeView } from '@/features/acceptance/components/pilot-airframe-view';
import { RaiseDefectPanel } from '@/features/defects/components/raise-defect-panel';
import { useTagScan } from '@/features/airframes/components/tag-scan';
import { PageShell } from '@/components/ui/page-shell';
import { KioskUserActions, useKioskSession } from './kiosk-layout';

const backLink =
  'inline-flex min-h-touch items-center self-start rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold';

/** Pilots (and only pilots who are not also mechanics) start here after a kiosk sign-in. */
export const isPilotOnly = (roles: string[]) => roles.includes('pilot') && !roles.includes('mechanic');

export function PilotListRoute() {
  const session = useKioskSession();
  const navigate = useNavigate();
  const tagScan = useTagScan(
    (token) => void navigate(`/t/${encodeURIComponent(token)}`),
    'pick it below',
    'self-start',
  );
  if (!session.user.roles.includes('pilot')) return <Navigate to="/kiosk/airframes" replace />;
  return (
    <PageShell
      title="Pick the aircraft"
      eyebrow={`Pilot · ${session.kiosk.name}`}
      actions={<KioskUserActions session={session} />}
      showsLimits
    >
      <div className="flex flex-col gap-5">
        {tagScan.button}
        {tagScan.problem}
        <PilotFleetList hrefFor={(id) => `/pilot/airframes/${id}`} />
      </div>
      {tagScan.scanner}
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
