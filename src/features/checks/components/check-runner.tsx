import { useMemo, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useTranslation } from 'react-i18next';
import type { CheckKind, Unit } from '@shared/schemas/limits';
import type { SubmitCheck } from '@shared/schemas/checks';
import type { CheckCard, StoredCheck } from '@shared/schemas/checks';
import { ApiRequestError, errorMessage, isRetryable } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useDraftAnnouncement } from '../api/announce-draft';
import { checkCardQueryOptions, useCheckCard } from '../api/get-check-card';
import { useSubmitCheck } from '../api/submit-check';
import { rememberAmbientC, type CheckDraft, type DraftOwner, type StepId } from '../model/check-draft';
import { useCheckWords } from '../model/check-words';
import { judge } from '../model/judge';
import { enqueue } from '../model/send-queue';
import { useCheckDraft } from '../model/use-check-draft';
import { CheckpointStep } from './checkpoint-step';
import { ContextStep } from './context-step';
import { ProgressStrip, type StripItem } from './progress-strip';
import { ReviewStep } from './review-step';
import { SignStep } from './sign-step';
import { UsageLine, UsageStep } from './usage-step';

interface CheckRunnerProps {
  airframeId: number;
  kind: CheckKind;
  fleetNumber: string;
  owner: DraftOwner;
  signerName: string;
  /** A message to show on the review screen when the check comes back from the send queue. */
  initialNotice?: string | null;
  onSigned: (check: StoredCheck) => void;
  /** The check is signed but the server could not take it now: it waits in the send queue. */
  onQueued: (checkId: string) => void;
  onLeave: () => void;
}

function stepsOf(card: CheckCard): StepId[] {
  return [
    ...(card.requires.length > 0 ? (['context'] as const) : []),
    ...card.checkpoints.map((c) => `cp:${c.code}` as const),
    ...(card.lastUsage ? (['usage'] as const) : []),
    'review',
    'sign',
  ];
}

/** Exactly what is signed: the same object goes to the server now and, if it cannot be sent, from the queue later. */
export function submissionOf(draft: CheckDraft, card: CheckCard): Omit<SubmitCheck, 'pin'> {
  const servicing = card.checkpoints.flatMap((checkpoint) => {
    const entry = draft.servicing[checkpoint.code];
    return entry && draft.readings[checkpoint.code] ? [{ code: checkpoint.code, ...entry }] : [];
  });
  const note = draft.note.trim();
  return {
    id: draft.id,
    airframeId: draft.airframeId,
    kind: draft.kind,
    limitsVersionId: card.limitsVersion.id,
    context: draft.context,
    readings: card.checkpoints.flatMap((checkpoint) => {
      const entry = draft.readings[checkpoint.code];
      const photoIds = (draft.photos[checkpoint.code] ?? []).map((photo) => photo.id);
      const tool = checkpoint.tool ? draft.tools[checkpoint.code] : undefined;
      return entry
        ? [
            {
              code: checkpoint.code,
              entry,
              ...(photoIds.length > 0 ? { photoIds } : {}),
              ...(tool ? { tool } : {}),
            },
          ]
        : [];
    }),
    ...(servicing.length > 0 ? { servicing } : {}),
    ...(note !== '' ? { note } : {}),
    ...(card.lastUsage && draft.usage ? { usage: draft.usage } : {}),
  };
}

export function CheckRunner(props: CheckRunnerProps) {
  const { draft, stored, update, discard } = useCheckDraft(props.owner, props.airframeId, props.kind);
  const { t } = useTranslation('checks');
  useDraftAnnouncement(draft);
  if (!draft) return <p className="text-lead text-ink-muted">{t('runner.opening')}</p>;
  return <CheckRunnerBody {...props} draft={draft} stored={stored} update={update} discard={discard} />;
}

interface BodyProps extends CheckRunnerProps {
  draft: CheckDraft;
  stored: boolean;
  update: (change: (current: CheckDraft) => CheckDraft) => void;
  discard: () => Promise<void>;
}

function CheckRunnerBody({
  airframeId,
  kind,
  fleetNumber,
  owner,
  signerName,
  initialNotice = null,
  onSigned,
  onQueued,
  onLeave,
  draft,
  stored,
  update,
  discard,
}: BodyProps) {
  const card = useCheckCard(airframeId, kind);
  const queryClient = useQueryClient();
  const submit = useSubmitCheck();
  const { t, words } = useCheckWords();
  const [reviewNotice, setReviewNotice] = useState<string | null>(initialNotice);
  const [signProblem, setSignProblem] = useState<string | null>(null);
  const [usageNotice, setUsageNotice] = useState<string | null>(null);
  const setDraft = update;

  const steps = useMemo(() => (card.data ? stepsOf(card.data) : []), [card.data]);

  if (card.isPending) return <p className="text-lead text-ink-muted">{t('runner.loadingCard')}</p>;
  if (card.isError) {
    return (
      <Notice tone="warning" title={t('runner.cardFailedTitle')}>
        {errorMessage(card.error)} {t('runner.cardFailedKept')}
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
    ...(data.requires.length > 0
      ? [
          {
            id: 'context' as const,
            short: t('strip.contextShort'),
            name: t('strip.contextName'),
            verdict: data.requires.every((key) => draft.context[key] !== undefined)
              ? ('in_limits' as const)
              : null,
          },
        ]
      : []),
    ...data.checkpoints.map((checkpoint, index): StripItem => {
      const result = judge(checkpoint, draft.readings[checkpoint.code], draft.context);
      return {
        id: `cp:${checkpoint.code}`,
        short: words.number(index + 1, 0),
        name: t('strip.checkpointName', { number: index + 1, label: checkpoint.label }),
        verdict:
          result.kind === 'verdict'
            ? result.evaluation.verdict
            : result.kind === 'invalid'
              ? 'invalid'
              : null,
      };
    }),
    ...(data.lastUsage
      ? [
          {
            id: 'usage' as const,
            short: t('strip.usageShort'),
            name: t('strip.usageName'),
            verdict: draft.usage ? ('in_limits' as const) : null,
          },
        ]
      : []),
    { id: 'review', short: t('strip.reviewShort'), name: t('strip.reviewName'), verdict: null },
  ];

  const sign = (pin: string) => {
    setSignProblem(null);
    const submission = submissionOf(draft, data);
    const afterSigned = () => {
      if (draft.context.ambientTempC !== undefined)
        void rememberAmbientC(owner.kioskId, draft.context.ambientTempC).catch(() => undefined);
    };
    submit.mutate(
      { ...submission, pin },
      {
        onSuccess: (storedCheck) => {
          afterSigned();
          void discard();
          onSigned(storedCheck);
        },
        onError: (error) => {
          if (error instanceof ApiRequestError && error.code === 'limits_changed') {
            void queryClient.invalidateQueries({
              queryKey: checkCardQueryOptions(airframeId, kind).queryKey,
            });
            setReviewNotice(error.message);
            go('review');
            return;
          }
          if (error instanceof ApiRequestError && error.code.startsWith('usage_')) {
            // A figure behind the last one, or too far ahead: back to the figures, with the last one in words.
            setUsageNotice(error.message);
            go('usage');
            return;
          }
          if (!isRetryable(error)) {
            setSignProblem(errorMessage(error));
            return;
          }
          // No answer, or "try later": the check may or may not be stored. It keeps its id, so the queue's resends
          // are stored once; the draft is handed to the queue and leaves the screen.
          void enqueue(
            {
              id: draft.id,
              submission,
              draft: { ...draft, step: 'review' },
              fleetNumber,
              kind,
              owner: { ...owner, name: signerName },
            },
            pin,
            errorMessage(error),
          )
            .then(() => {
              afterSigned();
              return discard();
            })
            .then(() => onQueued(draft.id))
            .catch(() => setSignProblem(t('runner.notKeptForLater', { problem: errorMessage(error) })));
        },
      },
    );
  };

  const checkpointIndex = step.startsWith('cp:')
    ? data.checkpoints.findIndex((c) => `cp:${c.code}` === step)
    : -1;
  const checkpoint = data.checkpoints[checkpointIndex];

  return (
    <div className="flex flex-col gap-5">
      {!stored && (
        <Notice tone="caution" title={t('runner.storageTitle')}>
          {t('runner.storageBody')}
        </Notice>
      )}
      <div className="flex flex-wrap items-start gap-4">
        <div className="flex-1">
          <ProgressStrip
            items={items}
            current={step === 'sign' ? 'review' : step}
            onGo={(id) => {
              setReviewNotice(null);
              go(id);
            }}
          />
        </div>
        <Button tone="quiet" onClick={onLeave}>
          {t('runner.pause')}
        </Button>
      </div>

      {step === 'context' && (
        <ContextStep
          requires={data.requires}
          context={draft.context}
          ambientFromMemory={draft.ambientFromMemory}
          tempUnit={draft.tempUnit}
          onChange={(context, ambientFromMemory) =>
            setDraft((current) => ({ ...current, context, ambientFromMemory }))
          }
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
          typeCode={data.type.code}
          fluids={data.fluids ?? []}
          servicing={draft.servicing[checkpoint.code]}
          tool={draft.tools[checkpoint.code]}
          onTool={(number) =>
            setDraft((current) => {
              const tools = { ...current.tools };
              if (number === undefined) delete tools[checkpoint.code];
              else tools[checkpoint.code] = number;
              return { ...current, tools };
            })
          }
          photos={draft.photos[checkpoint.code] ?? []}
          onEntry={(entry) =>
            setDraft((current) => {
              const readings = { ...current.readings };
              if (entry === undefined) delete readings[checkpoint.code];
              else readings[checkpoint.code] = entry;
              return { ...current, readings };
            })
          }
          onUnit={(unit: Unit) =>
            setDraft((current) => ({ ...current, units: { ...current.units, [checkpoint.code]: unit } }))
          }
          onServicing={(servicing, reading) =>
            setDraft((current) => {
              const all = { ...current.servicing };
              const readings = { ...current.readings };
              if (servicing) all[checkpoint.code] = servicing;
              else delete all[checkpoint.code];
              if (reading) readings[checkpoint.code] = reading;
              else delete readings[checkpoint.code];
              return { ...current, servicing: all, readings };
            })
          }
          onAddPhoto={(photo) =>
            setDraft((current) => ({
              ...current,
              photos: {
                ...current.photos,
                [checkpoint.code]: [...(current.photos[checkpoint.code] ?? []), photo],
              },
            }))
          }
          onRemovePhoto={(id) =>
            setDraft((current) => ({
              ...current,
              photos: {
                ...current.photos,
                [checkpoint.code]: (current.photos[checkpoint.code] ?? []).filter((photo) => photo.id !== id),
              },
            }))
          }
          onBack={() => moveFrom(`cp:${checkpoint.code}`, -1)}
          onNext={() => moveFrom(`cp:${checkpoint.code}`, 1)}
        />
      )}

      {step === 'usage' && data.lastUsage && (
        <UsageStep
          last={data.lastUsage}
          value={draft.usage}
          notice={usageNotice}
          onChange={(usage) => setDraft((current) => ({ ...current, usage }))}
          onBack={() => moveFrom('usage', -1)}
          onNext={() => {
            setUsageNotice(null);
            moveFrom('usage', 1);
          }}
        />
      )}

      {step === 'review' && data.lastUsage && <UsageLine usage={draft.usage} onEdit={() => go('usage')} />}

      {step === 'review' && (
        <ReviewStep
          checkpoints={data.checkpoints}
          readings={draft.readings}
          servicing={draft.servicing}
          tools={draft.tools}
          photos={draft.photos}
          note={draft.note}
          context={draft.context}
          contextLine={words.context(draft.context)}
          notice={reviewNotice}
          onNote={(note) => setDraft((current) => ({ ...current, note }))}
          onEdit={(code) => go(`cp:${code}`)}
          onEditContext={() => go('context')}
          onSign={() => {
            setReviewNotice(null);
            // An after-flight is not signed without the figures it records.
            go(data.lastUsage && !draft.usage ? 'usage' : 'sign');
          }}
        />
      )}

      {step === 'sign' && (
        <SignStep
          fleetNumber={fleetNumber}
          kind={kind}
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
