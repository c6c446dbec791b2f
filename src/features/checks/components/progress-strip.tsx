import type { Verdict } from '@shared/schemas/limits';
import { ShapeIcon, verdictShape } from '@/components/ui/shapes';
import type { StepId } from '../model/check-draft';
import { useTranslation } from 'react-i18next';

export interface StripItem {
  id: StepId;
  short: string;
  name: string;
  verdict: Verdict | 'invalid' | null;
}

const verdictTone: Record<Verdict, string> = {
  in_limits: 'text-normal-text',
  service: 'text-caution-edge',
  out_of_limits: 'text-warning-text',
};

/** Where the mechanic is in the card; every done step is a button back to it. */
export function ProgressStrip({
  items,
  current,
  onGo,
}: {
  items: StripItem[];
  current: StepId;
  onGo: (id: StepId) => void;
}) {
  const { t } = useTranslation('checks');
  return (
    <nav aria-label={t('strip.label')} className="flex flex-wrap gap-2">
      {items.map((item) => {
        const here = item.id === current;
        return (
          <button
            key={item.id}
            type="button"
            aria-current={here ? 'step' : undefined}
            aria-label={t('strip.goTo', { name: item.name })}
            onClick={() => onGo(item.id)}
            className={`flex min-h-touch min-w-touch flex-col items-center justify-center gap-0.5 rounded-lg border-2 px-2 text-[22px] font-bold ${here ? 'border-signal-edge bg-signal-bright text-on-fill' : 'border-ink-line bg-ink-soft text-paper'}`}
          >
            <span>{item.short}</span>
            {item.verdict === null ? (
              <span
                aria-hidden
                className={`h-5 w-5 rounded-full border-2 ${here ? 'border-on-fill' : 'border-ink-muted'}`}
              />
            ) : item.verdict === 'invalid' ? (
              <span aria-hidden className={here ? 'text-on-fill' : 'text-caution-text'}>
                {t('strip.notJudged')}
              </span>
            ) : (
              <span className={here ? 'text-on-fill' : verdictTone[item.verdict]}>
                <ShapeIcon shape={verdictShape[item.verdict]} size={22} />
              </span>
            )}
          </button>
        );
      })}
    </nav>
  );
}
