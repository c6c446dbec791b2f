import { useState } from 'react';
import { inspectionSchema } from '@shared/schemas/defects';
import type { HoldDetail } from '@shared/schemas/holds';
import { Button } from '@/components/ui/button';
import { Notice, RefusalNotices } from '@/components/ui/notice';
import { TextBox } from '@/components/ui/text-box';
import { SignatureEntry, secretFor, type SigningChannel } from '@/components/ui/signature-entry';
import { useRecordHoldInspection } from '../api/record-hold-inspection';
import { useTranslation } from 'react-i18next';
import { fieldError } from '@/lib/field-error';

const statementBox = 'min-h-[120px] leading-snug';

/**
 * The second person's inspection of work that disturbed flight controls or another system (EASA Part-145 AMC on
 * error capturing, from memory): signed by someone who did not record the corrective action.
 */
export function HoldInspectionForm({
  hold,
  channel,
  userId,
}: {
  hold: HoldDetail;
  channel: SigningChannel;
  userId: number;
}) {
  const { t } = useTranslation('holds');
  const inspect = useRecordHoldInspection(hold.id);
  const [statement, setStatement] = useState('');
  const [secret, setSecret] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const given = hold.releaseReadiness.independentInspection.by;
  const ownWork = hold.correctiveActions.some((action) => action.recordedBy.id === userId);

  const submit = () => {
    const parsed = inspectionSchema.safeParse({ statement, ...secretFor(channel, secret) });
    if (!parsed.success) {
      setProblem(fieldError(parsed.error.issues[0]?.message) ?? t('inspection.check'));
      return;
    }
    setProblem(null);
    inspect.mutate(parsed.data, {
      onSuccess: () => setStatement(''),
      onSettled: () => setSecret(''),
    });
  };

  return (
    <section
      className="flex flex-col gap-4 rounded-2xl border-2 border-caution-edge bg-ink-soft p-5"
      aria-label={t('inspection.title')}
      data-testid="hold-inspection"
    >
      <h2 className="text-[32px] font-bold">{t('inspection.title')}</h2>
      <p className="text-[22px]">{t('inspection.text')}</p>
      {given.length > 0 && (
        <p className="text-[22px] font-semibold text-normal-text">
          {t('inspection.by', { names: given.join(', ') })}
        </p>
      )}
      {ownWork ? (
        <Notice tone="caution" title={t('inspection.ownWork')}>
          {t('inspection.ownWorkText')}
        </Notice>
      ) : (
        <>
          <TextBox
            label={t('inspection.what')}
            rows={3}
            boxClass={statementBox}
            value={statement}
            onChange={setStatement}
            placeholder={t('inspection.placeholder')}
          />
          <SignatureEntry
            channel={channel}
            value={secret}
            onChange={setSecret}
            onEnter={submit}
            testId="inspection-secret"
          />
          <RefusalNotices title={t('inspection.notSigned')} problem={problem} failed={inspect} />
          <Button tone="primary" size="large" disabled={inspect.isPending || secret === ''} onClick={submit}>
            {inspect.isPending ? t('inspection.signing') : t('inspection.sign')}
          </Button>
        </>
      )}
    </section>
  );
}
