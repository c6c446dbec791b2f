import type { TFunction } from 'i18next';
import { useState } from 'react';
import { countersignSchema, type CountersignInput } from '@shared/schemas/holds';
import type { HoldDetail } from '@shared/schemas/holds';
import { ataChapterWords } from '@shared/domain/authorisation';
import { errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice, RefusalNotices } from '@/components/ui/notice';
import { TextBox } from '@/components/ui/text-box';
import { ShapeIcon } from '@/components/ui/shapes';
import { SignatureEntry, secretFor } from '@/components/ui/signature-entry';
import { useCountersignHold } from '../api/countersign-hold';
import { recordTime } from '@/lib/when';
import { useTranslation } from 'react-i18next';
import { fieldError } from '@/lib/field-error';

type Decision = CountersignInput['decision'];

const reasonBox = 'min-h-[110px]';

const choice = (active: boolean, tone: 'go' | 'stop') =>
  `min-h-touch-lg flex-1 rounded-xl border-4 px-6 text-[30px] font-bold ${
    active
      ? tone === 'go'
        ? 'border-normal-edge bg-normal-bright text-on-fill'
        : 'border-warning-edge bg-warning text-white'
      : 'border-ink-line bg-ink-raised text-paper'
  }`;

/** Release or keep, signed by typing the PIN (kiosk) or the password (desk) again; the server has the last word. */
export function CountersignPanel({ hold, channel }: { hold: HoldDetail; channel: 'kiosk' | 'desk' }) {
  const { t } = useTranslation('holds');
  const countersign = useCountersignHold(hold.id);
  const [decision, setDecision] = useState<Decision>('release');
  const [reason, setReason] = useState('');
  const [secret, setSecret] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const readiness = hold.releaseReadiness;
  const missing = readiness.missing;
  const blocked = decision === 'release' && missing.length > 0;

  const submit = () => {
    const input = {
      decision,
      ...(reason.trim() ? { reason: reason.trim() } : {}),
      ...secretFor(channel, secret),
    };
    const parsed = countersignSchema.safeParse(input);
    if (!parsed.success) {
      setProblem(fieldError(parsed.error.issues[0]?.message) ?? t('countersign.check'));
      return;
    }
    setProblem(null);
    countersign.mutate(parsed.data, { onSettled: () => setSecret('') });
  };

  return (
    <section
      className="flex flex-col gap-4 rounded-2xl border-2 border-ink-line bg-ink-soft p-5"
      aria-label={t('countersign.title')}
    >
      <h2 className="text-[32px] font-bold">{t('countersign.title')}</h2>
      <div className="flex gap-4" role="radiogroup" aria-label={t('countersign.decision')}>
        <button
          type="button"
          role="radio"
          aria-checked={decision === 'release'}
          className={choice(decision === 'release', 'go')}
          onClick={() => setDecision('release')}
        >
          {t('countersign.release')}
        </button>
        <button
          type="button"
          role="radio"
          aria-checked={decision === 'keep'}
          className={choice(decision === 'keep', 'stop')}
          onClick={() => setDecision('keep')}
        >
          {t('countersign.keep')}
        </button>
      </div>

      {decision === 'release' && (
        <div className="flex flex-col gap-2" data-testid="release-readiness">
          <div className="text-[24px] font-semibold">{t('countersign.before')}</div>
          <ul className="flex flex-col gap-2 text-[22px]">
            <ReadinessItem done={hold.releaseReadiness.hasCorrectiveAction}>
              {t('countersign.actionRecorded')}
            </ReadinessItem>
            {readiness.independentInspection.needed && (
              <ReadinessItem done={readiness.independentInspection.by.length > 0}>
                {readiness.independentInspection.by.length > 0
                  ? t('countersign.inspectionBy', { names: readiness.independentInspection.by.join(', ') })
                  : t('countersign.inspectionNeeded')}
              </ReadinessItem>
            )}
            <ReadinessItem done={hold.releaseReadiness.recheck !== null}>
              {hold.releaseReadiness.recheck
                ? t('countersign.recheckBy', {
                    name: hold.releaseReadiness.recheck.signedBy,
                    at: recordTime(hold.releaseReadiness.recheck.signedAt),
                  })
                : t('countersign.recheckNeeded')}
            </ReadinessItem>
          </ul>
          <p className="text-[22px] text-ink-muted" data-testid="release-scope">
            {readiness.defectNumber !== null
              ? t('countersign.defect', { number: readiness.defectNumber })
              : ''}
            {t('countersign.scope', {
              type: hold.airframe.typeCode,
              chapters: chapterList(readiness.chapters, t),
            })}
          </p>
          {missing.length > 0 && (
            <ul
              className="flex flex-col gap-1 text-[22px] text-caution-text"
              aria-label={t('countersign.missing')}
              data-testid="readiness-missing"
            >
              {missing.map((sentence) => (
                <li key={sentence}>{sentence}</li>
              ))}
            </ul>
          )}
        </div>
      )}

      <TextBox
        label={decision === 'keep' ? t('countersign.why') : t('countersign.remark')}
        rows={2}
        boxClass={reasonBox}
        value={reason}
        onChange={setReason}
      />

      <SignatureEntry
        channel={channel}
        value={secret}
        onChange={setSecret}
        onEnter={() => {
          if (!blocked) submit();
        }}
        testId="countersign-pin"
      />

      <RefusalNotices title={t('countersign.notCountersigned')} problem={problem} />
      {countersign.isError && (
        <div data-testid="countersign-refused">
          <Notice
            tone="warning"
            title={decision === 'release' ? t('countersign.notReleased') : t('countersign.notCountersigned')}
          >
            {errorMessage(countersign.error)}
          </Notice>
        </div>
      )}
      {countersign.isSuccess && countersign.data.state === 'open' && (
        <Notice tone="caution" title={t('countersign.kept')}>
          {t('countersign.keptText')}
        </Notice>
      )}
      <Button
        tone={decision === 'release' ? 'go' : 'stop'}
        size="large"
        disabled={blocked || countersign.isPending || secret === ''}
        onClick={submit}
      >
        {countersign.isPending
          ? t('countersign.signing')
          : decision === 'release'
            ? t('countersign.signRelease')
            : t('countersign.signKeep')}
      </Button>
    </section>
  );
}

const chapterList = (chapters: readonly (string | null)[], t: TFunction<'holds'>) =>
  chapters.length === 0
    ? t('countersign.anyChapter')
    : chapters.map((c) => (c === null ? t('countersign.allChapters') : ataChapterWords(c))).join(', ');

function ReadinessItem({ done, children }: { done: boolean; children: string }) {
  const { t } = useTranslation('holds');
  return (
    <li className="flex items-center gap-3" data-done={done}>
      <ShapeIcon
        shape={done ? 'circle-check' : 'dashed'}
        size={30}
        className={done ? 'text-normal-text' : 'text-caution-text'}
      />
      <span>
        <span className="sr-only">{done ? t('countersign.done') : t('countersign.notYet')}</span>
        {children}
      </span>
    </li>
  );
}
