import type { Checkpoint, CheckContext, ReadingEntry } from '@shared/schemas/limits';
import { judgeSubmission } from '@shared/domain/judge';
import { calendarDay } from '@/lib/when';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { photoUrl } from '../api/upload-photo';
import type { PhotoRef, ServicingDraft } from '../model/check-draft';
import { forScreen } from '../model/judge';
import { useCheckWords } from '../model/check-words';

// The most a defect note holds, as the server accepts it.
const noteMax = 2000;

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
  const { t, words } = useCheckWords();
  // The same judgement the server signs with: the warning shown here is the verdict stored.
  const judged = judgeSubmission(checkpoints, {
    readings: checkpoints.flatMap(({ code }) => (readings[code] ? [{ code, entry: readings[code] }] : [])),
    context,
  });
  const rows = judged.card.map(({ checkpoint, entry, judgement }) => ({
    checkpoint,
    entry,
    result: forScreen(judgement),
  }));
  const open = rows.filter((row) => row.result.kind !== 'verdict');
  const worst = judged.verdict;
  const fluidLine = (added: ServicingDraft) =>
    t('review.fluid', {
      quantity: words.value(added.quantity.value, added.quantity.unit),
      spec: added.fluidSpec,
      batch: added.batch,
      day: added.canOpenedOn ? calendarDay(added.canOpenedOn) : t('review.dayNotEntered'),
      cart: added.tool ? t('review.withCart', { tool: added.tool }) : '',
      level: words.entry(added.levelBefore),
    });

  return (
    <div className="flex flex-col gap-5">
      <h2 className="text-[40px] font-bold">{t('review.title')}</h2>
      {notice && (
        <Notice tone="caution" title={t('review.lookAgain')}>
          {notice}
        </Notice>
      )}
      <div className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-ink-line bg-ink-soft p-4">
        <span className="mr-auto text-[24px]">{contextLine}</span>
        <Button tone="quiet" onClick={onEditContext}>
          {t('nav.change')}
        </Button>
      </div>
      <ul className="flex flex-col gap-3" aria-label={t('review.readings')}>
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
                    : t('words.notReadYet')}
              </div>
              {servicing[checkpoint.code] && (
                <div
                  data-testid={`review-fluid-${checkpoint.code}`}
                  className="text-[22px] font-semibold text-signal-text"
                >
                  {fluidLine(servicing[checkpoint.code]!)}
                </div>
              )}
              {checkpoint.tool && tools[checkpoint.code] && (
                <div data-testid={`review-tool-${checkpoint.code}`} className="text-[22px] text-ink-muted">
                  {t('review.readWith', { tool: tools[checkpoint.code] })}
                </div>
              )}
              {(photos[checkpoint.code] ?? []).length > 0 && (
                <div
                  className="mt-2 flex flex-wrap gap-2"
                  aria-label={t('photos.photosOf', { subject: checkpoint.label })}
                >
                  {(photos[checkpoint.code] ?? []).map((photo, index) => (
                    <img
                      key={photo.id}
                      src={photoUrl(photo.id)}
                      alt={t('photos.photoOf', { number: index + 1, subject: checkpoint.label })}
                      className="h-[80px] w-[80px] rounded-md border-2 border-ink-line object-cover"
                    />
                  ))}
                </div>
              )}
            </div>
            <span className="tabular text-[32px] font-bold">{words.entry(entry)}</span>
            {result.kind === 'verdict' ? (
              <VerdictBadge verdict={result.evaluation.verdict} />
            ) : (
              <span className="text-[22px] font-bold text-caution-text">{t('review.toDo')}</span>
            )}
            <Button
              tone="quiet"
              aria-label={t('review.changeLabel', { label: checkpoint.label })}
              onClick={() => onEdit(checkpoint.code)}
            >
              {t('nav.change')}
            </Button>
          </li>
        ))}
      </ul>
      <div className="flex flex-col gap-2">
        <label htmlFor="defect-note" className="text-[24px] font-semibold">
          {t('review.noteLabel')}
        </label>
        <textarea
          id="defect-note"
          data-testid="defect-note"
          rows={5}
          maxLength={noteMax}
          value={note}
          onChange={(event) => onNote(event.target.value)}
          placeholder={t('review.notePlaceholder')}
          className="min-h-[200px] w-full rounded-xl border-2 border-ink-line bg-ink px-5 py-4 text-[26px] leading-snug text-paper placeholder:text-ink-muted"
        />
        <p className="text-[20px] text-ink-muted">
          {t('review.noteLength', { length: note.length, max: noteMax })}
        </p>
      </div>
      {open.length > 0 ? (
        <Notice tone="caution" title={t('review.stillToRead', { count: open.length })}>
          {t('review.stillToReadBody')}
        </Notice>
      ) : worst === 'out_of_limits' ? (
        <Notice tone="warning" title={t('review.outTitle')}>
          {t('review.outBody')}
        </Notice>
      ) : worst === 'service' ? (
        <Notice tone="caution" title={t('review.serviceTitle')}>
          {t('review.serviceBody')}
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
            {t('review.goTo', { label: open[0].checkpoint.label })}
          </Button>
        )}
        <Button tone="go" size="large" className="flex-1" disabled={open.length > 0} onClick={onSign}>
          {t('review.sign')}
        </Button>
      </div>
    </div>
  );
}
