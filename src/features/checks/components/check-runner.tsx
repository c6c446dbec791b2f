import { useEffect, useMemo, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { CheckContext, CheckKind, Unit } from '../../../../shared/schemas/limits';
import type { CheckCard, StoredCheck } from '../../../../shared/schemas/api';
import { checkKindLabels } from '../../../../shared/schemas/checks';
import { ApiRequestError, errorMessage } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { checkCardQueryOptions, useCheckCard } from '../api/get-check-card';
import { useSubmitCheck } from '../api/submit-check';
import { discardDraft, loadDraft, newDraft, rememberAmbientC, saveDraft, type CheckDraft, type DraftOwner, type StepId } from '../model/check-draft';
import { judge } from '../model/judge';
import { CheckpointStep } from './checkpoint-step';
import { ContextStep } from './context-step';
import { ProgressStrip, type StripItem } from './progress-strip';
import { ReviewStep } from './review-step';
import { SignStep } from './sign-step';

interface CheckRunnerProps {
  airframeId: number;
  kind: CheckKind;
  fleetNumber: string;
  owner: DraftOwner;
  signerName: string;
  onSigned: (check: StoredCheck) => void;
  onLeave: () => void;
}

function stepsOf(card: CheckCard): StepId[] {
  return [...(card.requires.length > 0 ? (['context'] as const) : []), ...card.checkpoints.map((c) => `cp:${c.code}` as const), 'review', 'sign'];
}

export function describeContext(context: CheckContext): string {
  const parts: string[] = [];
  if (context.attitude) parts.push(context.attitude === 'on_wheels' ? 'On wheels' : 'On jacks, gear retracted');
  if (context.systemPressure) parts.push(context.systemPressure === 'on' ? 'System pressure on' : 'System pressure relieved');
  if (context.ambientTempC !== undefined) parts.push(`${context.ambientTempC.toFixed(1)} °C`);
  return parts.length > 0 ? parts.join(' · ') : 'No configuration needed';
}

export function CheckRunner({ airframeId, kind, fleetNumber, owner, signerName, onSigned, onLeave }: CheckRunnerProps) {
  const card = useCheckCard(airframeId, kind);
  const queryClient = useQueryClient();
  const submit = useSubmitCheck();
  const [draft, setDraft] = useState<CheckDraft>(() => loadDraft(owner, airframeId, kind) ?? newDraft(owner, airframeId, kind));
  const [reviewNotice, setReviewNotice] = useState<string | null>(null);
  const [signProblem, setSignProblem] = useState<string | null>(null);

  useEffect(() => saveDraft(owner, draft), [owner, draft]);

  const steps = useMemo(() => (card.data ? stepsOf(card.data) : []), [card.data]);

  if (card.isPending) return <p className="text-lead text-ink-muted">Loading the check card…</p>;
  if (card.isError) {
    return (
      <Notice tone="warning" title="The check card did not load">
        {errorMessage(card.error)}
      </Notice>
    );
  }
  const data = card.data;
  const step: StepId = steps.includes(draft.step) ? draft.step : (steps[0] ?? 'review');
  const go = (next: StepId) => setDraft((current) => ({ ...current, step: next }));
  // Moves relative to the step the button belongs to, not to wherever the draft is now: a glove's double tap
  // (or an auto-advance racing a tap) then moves one step, never two.
  const moveFrom = (from: StepId, offset: 1 | -1) =>
    setDraft((current) => {
      const currentStep = steps.includes(current.step) ? current.step : (steps[0] ?? 'review');
      if (currentStep !== from) return current;
      const target = steps[Math.min(steps.length - 1, Math.max(0, steps.indexOf(from) + offset))];
      return target ? { ...current, step: target } : current;
    });

  const items: StripItem[] = [
    ...(data.requires.length > 0 ? [{ id: 'context' as const, short: 'Set', name: 'aircraft configuration', verdict: data.requires.every((key) => draft.context[key] !== undefined) ? ('in_limits' as const) : null }] : []),
    ...data.checkpoints.map((checkpoint, index): StripItem => {
      const result = judge(checkpoint, draft.readings[checkpoint.code], draft.context);
      return {
        id: `cp:${checkpoint.code}`,
        short: String(index + 1),
        name: `checkpoint ${index + 1}, ${checkpoint.label}`,
        verdict: result.kind === 'verdict' ? result.evaluation.verdict : result.kind === 'invalid' ? 'invalid' : null,
      };
    }),
    { id: 'review', short: 'Rev', name: 'review', verdict: null },
  ];

  const sign = (pin: string) => {
    setSignProblem(null);
    submit.mutate(
      {
        id: draft.id,
        airframeId,
        kind,
        limitsVersionId: data.limitsVersion.id,
        context: draft.context,
        readings: data.checkpoints.flatMap((checkpoint) => {
          const entry = draft.readings[checkpoint.code];
          return entry ? [{ code: checkpoint.code, entry }] : [];
        }),
        pin,
      },
      {
        onSuccess: (stored) => {
          if (draft.context.ambientTempC !== undefined) rememberAmbientC(owner.kioskId, draft.context.ambientTempC);
          discardDraft(owner, airframeId, kind);
          onSigned(stored);
        },
        onError: (error) => {
          if (error instanceof ApiRequestError && error.code === 'limits_changed') {
            void queryClient.invalidateQueries({ queryKey: checkCardQueryOptions(airframeId, kind).queryKey });
            setReviewNotice(error.message);
            go('review');
            return;
          }
          if (error instanceof ApiRequestError) {
            setSignProblem(error.message);
            return;
          }
          // No answer: the check may or may not be stored. Its id stays the same, so sending again is safe.
          setSignProblem(`${errorMessage(error)} Press Sign again when the network is back; the check is stored only once.`);
        },
      },
    );
  };

  const checkpointIndex = step.startsWith('cp:') ? data.checkpoints.findIndex((c) => `cp:${c.code}` === step) : -1;
  const checkpoint = data.checkpoints[checkpointIndex];

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-start gap-4">
        <div className="flex-1">
          <ProgressStrip items={items} current={step === 'sign' ? 'review' : step} onGo={(id) => { setReviewNotice(null); go(id); }} />
        </div>
        <Button tone="quiet" onClick={onLeave}>
          Pause
        </Button>
      </div>

      {step === 'context' && (
        <ContextStep
          requires={data.requires}
          context={draft.context}
          ambientFromMemory={draft.ambientFromMemory}
          tempUnit={draft.tempUnit}
          onChange={(context, ambientFromMemory) => setDraft((current) => ({ ...current, context, ambientFromMemory }))}
          onTempUnit={(tempUnit) => setDraft((current) => ({ ...current, tempUnit }))}
          onNext={() => moveFrom('context', 1)}
        />
      )}

      {checkpoint && (
        <CheckpointStep
          key={checkpoint.code}
          checkpoint={checkpoint}
          index={checkpointIndex}
          total={data.checkpoints.length}
          entry={draft.readings[checkpoint.code]}
          context={draft.context}
          unit={draft.units[checkpoint.code] ?? checkpoint.unit}
          onEntry={(entry) =>
            setDraft((current) => {
              const readings = { ...current.readings };
              if (entry === undefined) delete readings[checkpoint.code];
              else readings[checkpoint.code] = entry;
              return { ...current, readings };
            })
          }
          onUnit={(unit: Unit) => setDraft((current) => ({ ...current, units: { ...current.units, [checkpoint.code]: unit } }))}
          onBack={() => moveFrom(`cp:${checkpoint.code}`, -1)}
          onNext={() => moveFrom(`cp:${checkpoint.code}`, 1)}
        />
      )}

      {step === 'review' && (
        <ReviewStep
          checkpoints={data.checkpoints}
          readings={draft.readings}
          context={draft.context}
          contextLine={describeContext(draft.context)}
          notice={reviewNotice}
          onEdit={(code) => go(`cp:${code}`)}
          onEditContext={() => go('context')}
          onSign={() => {
            setReviewNotice(null);
            go('sign');
          }}
        />
      )}

      {step === 'sign' && (
        <SignStep
          fleetNumber={fleetNumber}
          kindLabel={checkKindLabels[kind]}
          signerName={signerName}
          pending={submit.isPending}
          problem={signProblem}
          onSign={sign}
          onBack={() => go('review')}
        />
      )}
    </div>
  );
}
