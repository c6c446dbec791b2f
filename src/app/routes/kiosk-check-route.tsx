import { useMemo } from 'react';
import { useTranslation } from 'react-i18next';
import { useLocation, useNavigate, useParams } from 'react-router-dom';
import { checkKindSchema } from '@shared/schemas/limits';
import { useAirframe } from '@/features/airframes/api/get-airframe';
import { CheckRunner } from '@/features/checks/components/check-runner';
import { PageShell } from '@/components/ui/page-shell';
import { Notice } from '@/components/ui/notice';
import { StateBadge } from '@/components/ui/state-badge';
import { errorMessage } from '@/lib/api-client';
import { KioskUserActions, useKioskSession } from './kiosk-layout';
import { checkKindLabel } from '@shared/schemas/plain';

export function KioskCheckRoute() {
  const session = useKioskSession();
  const navigate = useNavigate();
  const params = useParams();
  const location = useLocation();
  const { t } = useTranslation(['app', 'airframes']);
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
      <PageShell title={t('checkCard.noSuchCheck')}>
        <Notice tone="warning" title={t('checkCard.badLinkTitle')}>
          {t('checkCard.badLinkText')}
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
          <span className="text-ink-muted">{checkKindLabel(kind.data)}</span>
          {airframe.data && <StateBadge state={airframe.data.state} />}
        </span>
      }
      eyebrow={
        airframe.data
          ? t('checkCard.eyebrowWithType', { type: airframe.data.type.name })
          : t('checkCard.eyebrow')
      }
      actions={<KioskUserActions session={session} />}
      showsLimits
    >
      {airframe.isError && (
        <Notice tone="warning" title={t('checkCard.airframeNotLoaded')}>
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
