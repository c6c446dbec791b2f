import type { UsageFigures } from '@shared/schemas/usage';
import { formatFigure } from '@shared/domain/usage';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { lastUsageWords, UsageEntry } from '@/components/ui/usage-entry';

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
  const figures = value ?? last;
  return (
    <div className="flex flex-col gap-5">
      <h2 className="text-[40px] font-bold">Hours, flights and landings</h2>
      <p className="text-[24px] text-ink-muted">Enter what the aircraft shows now. {lastUsageWords(last)}</p>
      {notice && (
        <Notice tone="caution" title="Read the figures again">
          {notice}
        </Notice>
      )}
      <UsageEntry last={last} value={figures} onChange={onChange} />
      <div className="flex gap-4">
        <Button size="large" tone="quiet" onClick={onBack}>
          Back
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
          Next
        </Button>
      </div>
    </div>
  );
}

/** The figures on the review screen, with the way back to them; a check cannot be signed without them. */
export function UsageLine({ usage, onEdit }: { usage: UsageFigures | undefined; onEdit: () => void }) {
  return (
    <div className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-ink-line p-4 text-[24px]">
      <span className="flex-1">
        {usage
          ? `Recorded with this check: ${formatFigure('hours', usage.hours)}, ${formatFigure('flights', usage.flights)}, ${formatFigure('landings', usage.landings)}.`
          : 'The hours, flights and landings are not entered yet.'}
      </span>
      <Button tone={usage ? 'neutral' : 'primary'} onClick={onEdit}>
        {usage ? 'Change figures' : 'Enter figures'}
      </Button>
    </div>
  );
}
