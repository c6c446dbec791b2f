import { useTranslation } from 'react-i18next';
import { useNavigate, useParams } from 'react-router-dom';
import { useCheck } from '@/features/checks/api/get-check';
import { CheckResult } from '@/features/checks/components/check-result';
import { useAirframe } from '@/features/airframes/api/get-airframe';
import { Button } from '@/components/ui/button';
import { PageShell } from '@/components/ui/page-shell';
import { Notice } from '@/components/ui/notice';
import { errorMessage } from '@/lib/api-client';
import { KioskUserActions, useKioskSession } from './kiosk-layout';

const airframesPath = '/kiosk/airframes';

export function KioskResultRoute() {
  const session = useKioskSession();
  const navigate = useNavigate();
  const { checkId = '' } = useParams();
  const { t } = useTranslation('app');
  const check = useCheck(checkId);
  const airframe = useAirframe(check.data?.airframe.id ?? 0, check.data !== undefined);
  return (
    <PageShell
      title={t('result.title')}
      eyebrow={t('result.eyebrow')}
      actions={<KioskUserActions session={session} />}
      showsLimits
    >
      {check.isPending && <p className="text-lead text-ink-muted">{t('result.loading')}</p>}
      {check.isError && (
        <Notice tone="warning" title={t('result.notLoaded')}>
          {errorMessage(check.error)}
        </Notice>
      )}
      {check.data && (
        // A cached state from before this record would contradict it: wait for the fresh one.
        <CheckResult
          check={check.data}
          airframe={airframe.isFetching ? undefined : airframe.data}
          now={airframe.dataUpdatedAt || Date.now()}
        />
      )}
      <div className="mt-6 flex flex-wrap gap-4">
        <Button tone="primary" size="large" className="flex-1" onClick={() => void navigate(airframesPath)}>
          {t('backToAirframes')}
        </Button>
        <Button tone="neutral" size="large" className="flex-1" onClick={session.signOut}>
          {t('result.doneSignOut')}
        </Button>
      </div>
    </PageShell>
  );
}
