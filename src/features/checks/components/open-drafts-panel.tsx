import { useState } from 'react';
import { closeDraftSchema, type OpenDraft } from '@shared/schemas/checks';
import { recordTime } from '@/lib/when';
import { errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice, RefusalNotices } from '@/components/ui/notice';
import { TextBox } from '@/components/ui/text-box';
import { useCloseDraft } from '../api/close-draft';
import { useOpenDrafts } from '../api/get-open-drafts';
import { useTranslation } from 'react-i18next';
import { useCheckWords } from '../model/check-words';
import { fieldError } from '@/lib/field-error';

const reasonBoxClass = 'min-h-[90px]';

function DraftRow({ draft, canClose }: { draft: OpenDraft; canClose: boolean }) {
  const { t, words } = useCheckWords();
  const close = useCloseDraft();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <li
      className="flex flex-col gap-3 rounded-xl border-2 border-l-[10px] border-ink-line border-l-signal-edge bg-ink-soft p-4"
      data-testid={`draft-${draft.airframe.fleetNumber}`}
    >
      <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-[22px]">
        <strong className="tabular text-[32px]">{draft.airframe.fleetNumber}</strong>
        <span>
          {t('drafts.startedBy', {
            kind: words.kind(draft.kind),
            name: draft.startedBy,
            started: recordTime(draft.startedAt),
            touched: recordTime(draft.touchedAt),
          })}
        </span>
        {canClose && !open && (
          <Button className="ml-auto" onClick={() => setOpen(true)}>
            {t('drafts.closeCheck')}
          </Button>
        )}
      </div>
      {open && (
        <div className="flex flex-col gap-3">
          <TextBox
            label={t('drafts.reasonLabel')}
            size="touch"
            rows={2}
            boxClass={reasonBoxClass}
            value={reason}
            onChange={setReason}
            placeholder={t('drafts.reasonPlaceholder')}
          />
          <RefusalNotices title={t('drafts.notClosed')} problem={problem} failed={close} />
          <div className="flex gap-3">
            <Button
              tone="stop"
              disabled={close.isPending}
              onClick={() => {
                const parsed = closeDraftSchema.safeParse({ reason });
                if (!parsed.success) {
                  setProblem(fieldError(parsed.error.issues[0]?.message) ?? t('drafts.sayWhy'));
                  return;
                }
                setProblem(null);
                close.mutate({ draftId: draft.id, input: parsed.data });
              }}
            >
              {close.isPending
                ? t('drafts.closing')
                : t('drafts.close', { check: words.kindCheck(draft.kind) })}
            </Button>
            <Button tone="quiet" onClick={() => setOpen(false)}>
              {t('nav.cancel')}
            </Button>
          </div>
        </div>
      )}
    </li>
  );
}

/**
 * Checks started on a tablet and not signed: each holds its airframe "in progress" (and so blocks acceptance)
 * until it is signed, abandoned for 30 minutes, or closed here by a shift lead with a reason.
 */
export function OpenDraftsPanel({ canClose }: { canClose: boolean }) {
  const { t } = useTranslation('checks');
  const drafts = useOpenDrafts();
  return (
    <section className="flex flex-col gap-3" aria-label={t('drafts.title')} data-testid="open-drafts">
      <h2 className="text-[30px] font-bold">{t('drafts.title')}</h2>
      {drafts.isPending && <p className="text-[22px] text-ink-muted">{t('drafts.loading')}</p>}
      {drafts.isError && (
        <Notice tone="warning" title={t('drafts.loadFailed')}>
          {errorMessage(drafts.error)}
        </Notice>
      )}
      {drafts.data?.length === 0 && <p className="text-[22px] text-ink-muted">{t('drafts.none')}</p>}
      {drafts.data && drafts.data.length > 0 && (
        <ul className="flex flex-col gap-3">
          {drafts.data.map((draft) => (
            <DraftRow key={draft.id} draft={draft} canClose={canClose} />
          ))}
        </ul>
      )}
    </section>
  );
}
