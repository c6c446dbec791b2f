import { useTranslation } from 'react-i18next';
/** Shown wherever limits appear: the app records and compares; people and approved data decide. */
export function LimitsNotice({ tone = 'dark' }: { tone?: 'dark' | 'light' }) {
  const { t } = useTranslation('common');
  return (
    <p
      className={`text-[20px] leading-snug ${tone === 'dark' ? 'text-ink-muted' : 'text-paper-muted'}`}
      data-testid="limits-notice"
    >
      {t('limitsNotice')}
    </p>
  );
}
