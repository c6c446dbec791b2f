import type { UsageFigures } from '@shared/schemas/usage';
import { formatFigure } from '@shared/domain/usage';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { lastUsageWords, UsageEntry } from '@/components/ui/usage-entry';
import { useTranslation } from 'react-i18next';

interface UsageStepProps {
  /** The airframe's figures as last recorded; the entry starts from them. */
  last: UsageFigures;
  value: UsageFigures | undefined;
  /** The server's refusal of the last attempt, in its words. */
  notice: string | null;
  onChange: (value: UsageFigures) => void;
  onBack: () => void;
  onNext: () => void;
}

/** The after-flight's step for the airframe's hours, flights and landings, before the review. */
export function UsageStep({ last, value, notice, onChange, onBack, onNext }: UsageStepProps) {
  const { t } = useTranslation('checks');
  const figures = value ?? last;
  return (
    <div className="flex flex-col gap-5">
      <h2 className="text-[40px] font-bold">{t('usage.title')}</h2>
      <p className="text-[24px] text-ink-muted">
        {t('usage.intro')} {lastUsageWords(last)}
      </p>
      {notice && (
        <Notice tone="caution" title={t('usage.readAgain')}>
          {notice}
        </Notice>
      )}
      <UsageEntry last={last} value={figures} onChange={onChange} />
      <div className="flex gap-4">
        <Button size="large" tone="quiet" onClick={onBack}>
          {t('nav.back')}
        </Button>
        <Button
          size="large"
          tone="primary"
          className="flex-1"
          onClick={() => {
            if (!value) onChange(figures);
            onNext();
          }}
        >
          {t('nav.next')}
        </Button>
      </div>
    </div>
  );
}

/** The figures on the review screen, with the way back to them; a check cannot be signed without them. */
export function UsageLine({ usage, onEdit }: { usage: UsageFigures | undefined; onEdit: () => void }) {
  const { t } = useTranslation('checks');
  return (
    <div className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-ink-line p-4 text-[24px]">
      <span className="flex-1">
        {usage
          ? t('usage.recorded', {
              hours: formatFigure('hours', usage.hours),
              flights: formatFigure('flights', usage.flights),
              landings: formatFigure('landings', usage.landings),
            })
          : t('usage.notEntered')}
      </span>
      <Button tone={usage ? 'neutral' : 'primary'} onClick={onEdit}>
        {usage ? t('usage.changeFigures') : t('usage.enterFigures')}
      </Button>
    </div>
  );
}
