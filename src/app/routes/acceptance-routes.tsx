import { useTranslation } from 'react-i18next';
import { Link, Navigate, useNavigate, useParams } from 'react-router-dom';
import { PilotFleetList } from '@/features/acceptance/components/pilot-fleet-list';
import { PilotAirframeView } from '@/features/acceptance/components/pilot-airframe-view';
import { RaiseDefectPanel } from '@/features/defects/components/raise-defect-panel';
import { useTagScan } from '@/features/airframes/components/tag-scan';
import { PageShell } from '@/components/ui/page-shell';
import { KioskUserActions, useKioskSession } from './kiosk-layout';

// Defects raised here are signed on the kiosk keypad.
const kioskChannel = 'kiosk' as const;
const backLink =
  'inline-flex min-h-touch items-center self-start rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold';

/** Pilots (and only pilots who are not also mechanics) start here after a kiosk sign-in. */
export const isPilotOnly = (roles: string[]) => roles.includes('pilot') && !roles.includes('mechanic');

export function PilotListRoute() {
  const session = useKioskSession();
  const navigate = useNavigate();
  const { t } = useTranslation('app');
  const tagScan = useTagScan(
    (token) => void navigate(`/t/${encodeURIComponent(token)}`),
    t('pilot.otherwise'),
    'self-start',
  );
  if (!session.user.roles.includes('pilot')) return <Navigate to="/kiosk/airframes" replace />;
  return (
    <PageShell
      title={t('pilot.listTitle')}
      eyebrow={t('pilot.eyebrow', { name: session.kiosk.name })}
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
  const { t } = useTranslation('app');
  if (!session.user.roles.includes('pilot'))
    return <Navigate to={`/kiosk/airframes/${airframeId}`} replace />;
  return (
    <PageShell
      title={t('pilot.airframeTitle')}
      eyebrow={t('pilot.eyebrow', { name: session.kiosk.name })}
      actions={<KioskUserActions session={session} />}
      showsLimits
    >
      <div className="flex flex-col gap-5">
        <Link to="/pilot" className={backLink}>
          {t('pilot.allAircraft')}
        </Link>
        <PilotAirframeView
          airframeId={airframeId}
          actions={(view) => (
            <RaiseDefectPanel
              airframeId={view.airframe.id}
              fleetNumber={view.airframe.fleetNumber}
              channel={kioskChannel}
            />
          )}
        />
      </div>
    </PageShell>
  );
}
