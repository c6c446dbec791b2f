import type { Checkpoint, CheckContext, ReadingEntry } from '@shared/schemas/limits';
import { judgeSubmission } from '@shared/domain/judge';
import { formatValue } from '@shared/domain/units';
import { calendarDay } from '@/lib/when';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { photoUrl } from '../api/upload-photo';
import type { PhotoRef, ServicingDraft } from '../model/check-draft';
import { describeEntry } from '@/lib/describe-entry';
import { forScreen } from '../model/judge';

interface ReviewStepProps {
  checkpoints: Checkpoint[];
  readings: Record<string, ReadingEntry>;
  servicing: Record<string, ServicingDraft>;
  tools: Record<string, string>;
  photos: Record<string, PhotoRef[]>;
  note: string;
  context: CheckContext;
  contextLine: string;
  notice: string | null;
  onNote: (note: string) => void;
  onEdit: (code: string) => void;
  onEditContext: () => void;
  onSign: () => void;
}

export function ReviewStep({
  checkpoints,
  readings,
  servicing,
  tools,
  photos,
  note,
  context,
  contextLine,
  notice,
  onNote,
  onEdit,
  onEditContext,
  onSign,
}: ReviewStepProps) {
  // The same judgement the server signs with: the warning shown here is the verdict stored.
  const judged = judgeSubmission(checkpoints, {
    readings: checkpoints.flatMap(({ code }) => (readings[code] ? [{ code, entry: readings[code] }] : [])),
    context,
  });
  const rows = judged.card.map(({ checkpoint, entry, judgement }) => ({
    checkpoint,
    entry,
    result: forScreen(checkpoint, judgement),
  }));
  const open = rows.filter((row) => row.result.kind !== 'verdict');
  const worst = judged.verdict;

  return (
    <div className="flex flex-col gap-5">
      <h2 className="text-[40px] font-bold">Review before signing</h2>
      {notice && (
        <Notice tone="caution" title="Look again">
          {notice}
        </Notice>
      )}
      <div className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-ink-line bg-ink-soft p-4">
        <span className="mr-auto text-[24px]">{contextLine}</span>
        <Button tone="quiet" onClick={onEditContext}>
          Change
        </Button>
      </div>
      <ul className="flex flex-col gap-3" aria-label="Readings">
        {rows.map(({ checkpoint, entry, result }) => (
          <li
            key={checkpoint.code}
            data-testid={`review-${checkpoint.code}`}
            className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-ink-line bg-ink-soft p-3"
          >
            <div className="min-w-[220px] flex-1">
              <div className="text-[24px] font-semibold">{checkpoint.label}</div>
              <div className="text-[22px] text-ink-muted">
                {result.kind === 'verdict'
                  ? result.evaluation.message
                  : result.kind === 'invalid'
                    ? result.message
                    : 'Not read yet'}
              </div>
              {servicing[checkpoint.code] && (
                <div
                  data-testid={`review-fluid-${checkpoint.code}`}
                  className="text-[22px] font-semibold text-signal-text"
                >
                  Fluid added:{' '}
                  {formatValue(
                    servicing[checkpoint.code]!.quantity.value,
                    servicing[checkpoint.code]!.quantity.unit,
                  )}{' '}
                  {servicing[checkpoint.code]!.fluidSpec}, batch {servicing[checkpoint.code]!.batch}, can
                  opened{' '}
                  {servicing[checkpoint.code]!.canOpenedOn
                    ? calendarDay(servicing[checkpoint.code]!.canOpenedOn)
                    : 'on a day not entered yet'}
                  {servicing[checkpoint.code]!.tool && <> with cart {servicing[checkpoint.code]!.tool}</>} ·
                  level before {describeEntry(servicing[checkpoint.code]!.levelBefore)}
                </div>
              )}
              {checkpoint.tool && tools[checkpoint.code] && (
                <div data-testid={`review-tool-${checkpoint.code}`} className="text-[22px] text-ink-muted">
                  Read with {tools[checkpoint.code]}
                </div>
              )}
              {(photos[checkpoint.code] ?? []).length > 0 && (
                <div className="mt-2 flex flex-wrap gap-2" aria-label={`Photos of ${checkpoint.label}`}>
                  {(photos[checkpoint.code] ?? []).map((photo, index) => (
                    <img
                      key={photo.id}
                      src={photoUrl(photo.id)}
                      alt={`Photo ${index + 1} of ${checkpoint.label}`}
                      className="h-[80px] w-[80px] rounded-md border-2 border-ink-line object-cover"
                    />
                  ))}
                </div>
              )}
            </div>
            <span className="tabular text-[32px] font-bold">{describeEntry(entry)}</span>
            {result.kind === 'verdict' ? (
              <VerdictBadge verdict={result.evaluation.verdict} />
            ) : (
              <span className="text-[22px] font-bold text-caution-text">TO DO</span>
            )}
            <Button
              tone="quiet"
              aria-label={`Change ${checkpoint.label}`}
              onClick={() => onEdit(checkpoint.code)}
            >
              Change
            </Button>
          </li>
        ))}
      </ul>
      <div className="flex flex-col gap-2">
        <label htmlFor="defect-note" className="text-[24px] font-semibold">
          Defect note (optional)
        </label>
        <textarea
          id="defect-note"
          data-testid="defect-note"
          rows={5}
          maxLength={2000}
          value={note}
          onChange={(event) => onNote(event.target.value)}
          placeholder="What you saw: leaks, damage, anything the shift lead should know."
          className="min-h-[200px] w-full rounded-xl border-2 border-ink-line bg-ink px-5 py-4 text-[26px] leading-snug text-paper placeholder:text-ink-muted"
        />
        <p className="text-[20px] text-ink-muted">
          {note.length} of 2000 characters · signed with the readings
        </p>
      </div>
      {open.length > 0 ? (
        <Notice
          tone="caution"
          title={`${open.length} checkpoint${open.length === 1 ? '' : 's'} still to read`}
        >
          Every checkpoint needs a reading that can be judged before you sign.
        </Notice>
      ) : worst === 'out_of_limits' ? (
        <Notice tone="warning" title="Out of limits: signing puts the airframe on hold">
          The shift lead is told at once. Do not release the aircraft.
        </Notice>
      ) : worst === 'service' ? (
        <Notice tone="caution" title="Service needed">
          Sign to record the readings; do the servicing, then check again.
        </Notice>
      ) : null}
      <div className="flex gap-4">
        {open[0] && (
          <Button
            tone="neutral"
            size="large"
            className="flex-1"
            onClick={() => onEdit(open[0]!.checkpoint.code)}
          >
            Go to {open[0].checkpoint.label}
          </Button>
        )}
        <Button tone="go" size="large" className="flex-1" disabled={open.length > 0} onClick={onSign}>
          Sign with PIN
        </Button>
      </div>
    </div>
  );
}
