import { Trans, useTranslation } from 'react-i18next';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { localTime } from '@/lib/when';
import { checkKindLabel } from '@shared/schemas/plain';

export function LastCheckLine({ lastCheck }: { lastCheck: AirframeSummary['lastCheck'] }) {
  const { t } = useTranslation('airframes');
  if (!lastCheck) return <p className="text-[22px] text-ink-muted">{t('lastCheck.none')}</p>;
  return (
    <div className="flex flex-wrap items-center gap-3 text-[22px]">
      <span>
        <Trans
          t={t}
          i18nKey="lastCheck.line"
          values={{
            kind: checkKindLabel(lastCheck.kind),
            at: localTime(lastCheck.signedAt),
            by: lastCheck.signedBy,
          }}
          components={{ strong: <strong /> }}
        />
      </span>
      <VerdictBadge verdict={lastCheck.verdict} />
    </div>
  );
}
