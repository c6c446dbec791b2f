import { useMemo } from 'react';
import { useLocation, useNavigate, useParams } from 'react-router-dom';
import { checkKindSchema } from '@shared/schemas/limits';
import { checkKindLabels } from '@shared/schemas/plain';
import { useAirframe } from '@/features/airframes/api/get-airframe';
import { CheckRunner } from '@/features/checks/components/check-runner';
import { PageShell } from '@/components/ui/page-shell';
import { Notice } from '@/components/ui/notice';
import { StateBadge } from '@/components/ui/state-badge';
import { errorMessage } from '@/lib/api-client';
import { KioskUserActions, useKioskSession } from './kiosk-layout';

export function KioskCheckRoute() {
  const session = useKioskSession();
  const navigate = useNavigate();
  const params = useParams();
  const location = useLocation();
  const notice = (location.state as { notice?: string | null } | null)?.notice ?? null;
  const airframeId = Number(params.id);
  const kind = checkKindSchema.safeParse(params.kind);
  const airframe = useAirframe(airframeId);
  const owner = useMemo(
    () => ({ kioskId: session.kiosk.id, badge: session.user.badgeNumber }),
    [session.kiosk.id, session.user.badgeNumber],
  );

  if (!kind.success || !Number.isInteger(airframeId)) {
    return (
      <PageShell title="No such check">
        <Notice tone="warning" title="This link does not name a check">
          Go back to the airframe list and start the check from there.
        </Notice>
      </PageShell>
    );
  }
  const fleetNumber = airframe.data?.fleetNumber ?? '…';
  return (
    <PageShell
      title={
        <span className="flex flex-wrap items-center gap-4">
          <span className="tabular">{fleetNumber}</span>
          <span className="text-ink-muted">{checkKindLabels[kind.data]}</span>
          {airframe.data && <StateBadge state={airframe.data.state} />}
        </span>
      }
      eyebrow={`Check card${airframe.data ? ` · ${airframe.data.type.name}` : ''}`}
      actions={<KioskUserActions session={session} />}
      showsLimits
    >
      {airframe.isError && (
        <Notice tone="warning" title="The airframe did not load">
          {errorMessage(airframe.error)}
        </Notice>
      )}
      <CheckRunner
        airframeId={airframeId}
        kind={kind.data}
        fleetNumber={fleetNumber}
        owner={owner}
        signerName={session.user.name}
        initialNotice={notice}
        onSigned={(check) => void navigate(`/kiosk/checks/${check.id}`, { replace: true })}
        onQueued={(checkId) =>
          void navigate(`/kiosk/queue?signed=${encodeURIComponent(checkId)}`, { replace: true })
        }
        onLeave={() => void navigate(`/kiosk/airframes/${airframeId}`)}
      />
    </PageShell>
  );
}
