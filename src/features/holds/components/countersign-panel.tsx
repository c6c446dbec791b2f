import { useState } from 'react';
import { countersignSchema, type CountersignInput } from '@shared/schemas/holds';
import type { HoldDetail } from '@shared/schemas/holds';
import { ataChapters, type AtaScope } from '@shared/domain/authorisation';
import { errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice, RefusalNotices } from '@/components/ui/notice';
import { TextBox } from '@/components/ui/text-box';
import { ShapeIcon } from '@/components/ui/shapes';
import { SignatureEntry, secretFor } from '@/components/ui/signature-entry';
import { useCountersignHold } from '../api/countersign-hold';
import { recordTime } from '@/lib/when';

type Decision = CountersignInput['decision'];

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
      setProblem(parsed.error.issues[0]?.message ?? 'Check the countersign.');
      return;
    }
    setProblem(null);
    countersign.mutate(parsed.data, { onSettled: () => setSecret('') });
  };

  return (
    <section
      className="flex flex-col gap-4 rounded-2xl border-2 border-ink-line bg-ink-soft p-5"
      aria-label="Countersign"
    >
      <h2 className="text-[32px] font-bold">Countersign</h2>
      <div className="flex gap-4" role="radiogroup" aria-label="Decision">
        <button
          type="button"
          role="radio"
          aria-checked={decision === 'release'}
          className={choice(decision === 'release', 'go')}
          onClick={() => setDecision('release')}
        >
          Release
        </button>
        <button
          type="button"
          role="radio"
          aria-checked={decision === 'keep'}
          className={choice(decision === 'keep', 'stop')}
          onClick={() => setDecision('keep')}
        >
          Keep hold
        </button>
      </div>

      {decision === 'release' && (
        <div className="flex flex-col gap-2" data-testid="release-readiness">
          <div className="text-[24px] font-semibold">Before a release</div>
          <ul className="flex flex-col gap-2 text-[22px]">
            <ReadinessItem done={hold.releaseReadiness.hasCorrectiveAction}>
              Corrective action recorded
            </ReadinessItem>
            {readiness.independentInspection.needed && (
              <ReadinessItem done={readiness.independentInspection.by.length > 0}>
                {readiness.independentInspection.by.length > 0
                  ? `Independent inspection signed by ${readiness.independentInspection.by.join(', ')}`
                  : 'Independent inspection by a second person'}
              </ReadinessItem>
            )}
            <ReadinessItem done={hold.releaseReadiness.recheck !== null}>
              {hold.releaseReadiness.recheck
                ? `Passing re-check signed by ${hold.releaseReadiness.recheck.signedBy}, ${recordTime(hold.releaseReadiness.recheck.signedAt)}`
                : 'A passing re-check signed'}
            </ReadinessItem>
          </ul>
          <p className="text-[22px] text-ink-muted" data-testid="release-scope">
            {readiness.defectNumber !== null ? `Defect ${readiness.defectNumber} in the tech log. ` : ''}
            The release is certified under an authorisation for {hold.airframe.typeCode},{' '}
            {chapterList(readiness.chapters)}.
          </p>
          {missing.length > 0 && (
            <ul
              className="flex flex-col gap-1 text-[22px] text-caution-text"
              aria-label="Still missing"
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
        label={decision === 'keep' ? 'Why the hold stays (needed)' : 'Remark (optional)'}
        rows={2}
        boxClass="min-h-[110px]"
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

      <RefusalNotices title="Not countersigned" problem={problem} />
      {countersign.isError && (
        <div data-testid="countersign-refused">
          <Notice tone="warning" title={decision === 'release' ? 'Not released' : 'Not countersigned'}>
            {errorMessage(countersign.error)}
          </Notice>
        </div>
      )}
      {countersign.isSuccess && countersign.data.state === 'open' && (
        <Notice tone="caution" title="Hold kept">
          Your countersign is recorded; the airframe stays on hold.
        </Notice>
      )}
      <Button
        tone={decision === 'release' ? 'go' : 'stop'}
        size="large"
        disabled={blocked || countersign.isPending || secret === ''}
        onClick={submit}
      >
        {countersign.isPending
          ? 'Signing…'
          : decision === 'release'
            ? 'Countersign and release'
            : 'Countersign: keep on hold'}
      </Button>
    </section>
  );
}

const chapterList = (chapters: readonly (string | null)[]) =>
  chapters.length === 0
    ? 'any chapter'
    : chapters
        .map((c) =>
          c === null ? 'all chapters (work not classified)' : (ataChapters[c as AtaScope] ?? `ATA ${c}`),
        )
        .join(', ');

function ReadinessItem({ done, children }: { done: boolean; children: string }) {
  return (
    <li className="flex items-center gap-3" data-done={done}>
      <ShapeIcon
        shape={done ? 'circle-check' : 'dashed'}
        size={30}
        className={done ? 'text-normal-text' : 'text-caution-text'}
      />
      <span>
        <span className="sr-only">{done ? 'Done: ' : 'Not yet: '}</span>
        {children}
      </span>
    </li>
  );
}
