import { useEffect, useRef } from 'react';
import { useTranslation } from 'react-i18next';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { useEnrolKiosk } from '@/features/kiosks/api/enrol-kiosk';
import { PageShell } from '@/components/ui/page-shell';
import { Notice } from '@/components/ui/notice';
import { errorMessage } from '@/lib/api-client';

export function EnrolRoute() {
  const { code = '' } = useParams();
  const enrol = useEnrolKiosk();
  const navigate = useNavigate();
  const started = useRef(false);
  const { t } = useTranslation('app');

  useEffect(() => {
    // A code works once; StrictMode's second effect run must not spend it again.
    if (started.current) return;
    started.current = true;
    enrol.mutate(code, {
      onSuccess: () => window.setTimeout(() => void navigate('/kiosk', { replace: true }), 1500),
    });
  }, [code, enrol, navigate]);

  return (
    <PageShell title={t('enrol.title')} eyebrow={t('enrol.eyebrow')}>
      <div className="flex max-w-[900px] flex-col gap-5">
        {enrol.isPending && <p className="text-lead">{t('enrol.enrolling')}</p>}
        {enrol.isSuccess && (
          <Notice tone="normal" big title={t('enrol.enrolledAs', { name: enrol.data.kiosk.name })}>
            {t('enrol.enrolledText')}
          </Notice>
        )}
        {enrol.isError && (
          <>
            <Notice tone="warning" big title={t('enrol.notEnrolled')}>
              {errorMessage(enrol.error)}
            </Notice>
            <Link
              to="/"
              className="inline-flex min-h-touch items-center self-start rounded-xl border-2 border-ink-line bg-ink-raised px-6 text-[24px] font-semibold"
            >
              {t('backToStart')}
            </Link>
          </>
        )}
      </div>
    </PageShell>
  );
}
