import { useState } from 'react';
import { inspectionSchema } from '@shared/schemas/defects';
import type { HoldDetail } from '@shared/schemas/holds';
import { Button } from '@/components/ui/button';
import { Notice, RefusalNotices } from '@/components/ui/notice';
import { TextBox } from '@/components/ui/text-box';
import { SignatureEntry, secretFor, type SigningChannel } from '@/components/ui/signature-entry';
import { useRecordHoldInspection } from '../api/record-hold-inspection';

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
  const inspect = useRecordHoldInspection(hold.id);
  const [statement, setStatement] = useState('');
  const [secret, setSecret] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const given = hold.releaseReadiness.independentInspection.by;
  const ownWork = hold.correctiveActions.some((action) => action.recordedBy.id === userId);

  const submit = () => {
    const parsed = inspectionSchema.safeParse({ statement, ...secretFor(channel, secret) });
    if (!parsed.success) {
      setProblem(parsed.error.issues[0]?.message ?? 'Check the inspection.');
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
      aria-label="Independent inspection"
      data-testid="hold-inspection"
    >
      <h2 className="text-[32px] font-bold">Independent inspection</h2>
      <p className="text-[22px]">
        The corrective action disturbed a system a second person must inspect before the release. Whoever
        recorded the corrective action cannot sign it.
      </p>
      {given.length > 0 && (
        <p className="text-[22px] font-semibold text-normal-text">Inspected by {given.join(', ')}</p>
      )}
      {ownWork ? (
        <Notice tone="caution" title="You recorded the corrective action">
          Another mechanic or lead inspects it and signs here.
        </Notice>
      ) : (
        <>
          <TextBox
            label="What you inspected"
            rows={3}
            boxClass="min-h-[120px] leading-snug"
            value={statement}
            onChange={setStatement}
            placeholder="e.g. Inspected the system 2 return union for security, locking and leaks; full and free movement."
          />
          <SignatureEntry
            channel={channel}
            value={secret}
            onChange={setSecret}
            onEnter={submit}
            testId="inspection-secret"
          />
          <RefusalNotices title="Not signed" problem={problem} failed={inspect} />
          <Button tone="primary" size="large" disabled={inspect.isPending || secret === ''} onClick={submit}>
            {inspect.isPending ? 'Signing…' : 'Sign the independent inspection'}
          </Button>
        </>
      )}
    </section>
  );
}
