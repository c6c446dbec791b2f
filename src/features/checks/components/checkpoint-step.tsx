import { useEffect, useRef, useState } from 'react';
import type { Checkpoint, CheckContext, Fluid, ReadingEntry, Unit } from '@shared/schemas/limits';
import { fluidToAdd, levelAfterTopUp, targetMark } from '@shared/domain/servicing';
import { convert } from '@shared/domain/units';
import { calendarDay } from '@/lib/when';
import { BottomBar, useStepInView } from '@/components/ui/bottom-bar';
import { Button } from '@/components/ui/button';
import type { PhotoRef, ServicingDraft } from '../model/check-draft';
import { judge } from '../model/judge';
import { LeakRateEntry } from './leak-rate-entry';
import { LevelEntry } from './level-entry';
import { LiveVerdict } from './live-verdict';
import { PhotoEvidence } from './photo-evidence';
import { ToolPicker } from './tool-picker';
import { ValueEntry } from './value-entry';
import { YesNoEntry } from './yes-no-entry';
import { useCheckWords } from '../model/check-words';
import { ServicingForm, type TargetMarkName } from './servicing-form';

interface CheckpointStepProps {
  checkpoint: Checkpoint;
  index: number;
  total: number;
  entry: ReadingEntry | undefined;
  context: CheckContext;
  unit: Unit | null;
  typeCode: string;
  fluids: Fluid[];
  servicing: ServicingDraft | undefined;
  /** The tool number the reading is taken with, when the checkpoint asks for one. */
  tool: string | undefined;
  onTool: (number: string | undefined) => void;
  photos: PhotoRef[];
  onEntry: (entry: ReadingEntry | undefined) => void;
  onUnit: (unit: Unit) => void;
  onServicing: (servicing: ServicingDraft | undefined, reading: ReadingEntry | undefined) => void;
  onAddPhoto: (photo: PhotoRef) => void;
  onRemovePhoto: (id: string) => void;
  onBack: () => void;
  onNext: () => void;
}

const lowPositions = new Set(['below_minimum', 'at_minimum', 'between_minimum_normal']);

/** How much a level reading asks for, or null when it needs no fluid (or is out of limits: that is a hold, not a top-up). */
export function fluidNeed(
  checkpoint: Checkpoint,
  entry: ReadingEntry | undefined,
  context: CheckContext,
): { toAddL: number | null; mark: TargetMarkName } | null {
  if (checkpoint.kind !== 'level' || entry === undefined) return null;
  const result = judge(checkpoint, entry, context);
  if (result.kind !== 'verdict' || result.evaluation.verdict === 'out_of_limits') return null;
  try {
    const mark = targetMark(checkpoint, context.attitude);
    const markName: TargetMarkName = mark.mark === 'maximum' ? 'maximum' : 'normal';
    if ('value' in entry) {
      const toAddL = fluidToAdd({
        checkpoint,
        currentLevelL: convert(entry.value, entry.unit, 'L'),
        ...(context.attitude ? { attitude: context.attitude } : {}),
      });
      return toAddL > 0 ? { toAddL, mark: markName } : null;
    }
    if ('position' in entry)
      return result.evaluation.verdict === 'service' || lowPositions.has(entry.position)
        ? { toAddL: null, mark: markName }
        : null;
  } catch {
    return null;
  }
  return null;
}

export function CheckpointStep(props: CheckpointStepProps) {
  const {
    checkpoint,
    index,
    total,
    entry,
    context,
    unit,
    typeCode,
    fluids,
    servicing,
    tool,
    onTool,
    photos,
    onEntry,
    onUnit,
    onServicing,
    onAddPhoto,
    onRemovePhoto,
    onBack,
    onNext,
  } = props;
  const { t, words } = useCheckWords();
  const [servicingOpen, setServicingOpen] = useState(false);
  const [rereadAsked, setRereadAsked] = useState(false);
  const headingRef = useRef<HTMLDivElement>(null);
  const entryRef = useRef<HTMLDivElement>(null);
  const barRef = useRef<HTMLDivElement>(null);
  // Each checkpoint opens with its label and its whole entry (keypad, glass, answers) clear of the Back/Next bar.
  useStepInView(headingRef, entryRef, barRef, `${checkpoint.code}:${servicingOpen}`);
  // After the top-up the glass is what matters: bring it fully on screen for the re-read.
  useEffect(() => {
    if (!rereadAsked) return;
    setRereadAsked(false);
    document.querySelector('[data-testid="sight-glass"]')?.scrollIntoView({ block: 'center' });
  }, [rereadAsked]);
  const result = judge(checkpoint, entry, context);
  const marks = checkpoint.marks;
  const need = servicing ? null : fluidNeed(checkpoint, entry, context);
  const expectedAfter =
    servicing && 'value' in servicing.levelBefore
      ? levelAfterTopUp({
          currentLevelL: convert(servicing.levelBefore.value, servicing.levelBefore.unit, 'L'),
          addedL: convert(servicing.quantity.value, servicing.quantity.unit, 'L'),
        })
      : null;

  if (servicingOpen) {
    const levelBefore = servicing?.levelBefore ?? entry;
    if (levelBefore !== undefined) {
      const before = fluidNeed(checkpoint, levelBefore, context);
      return (
        <ServicingForm
          checkpoint={checkpoint}
          typeCode={typeCode}
          fluids={fluids}
          levelBefore={levelBefore}
          toAddL={before?.toAddL ?? null}
          mark={before?.mark ?? 'normal'}
          existing={servicing}
          onCancel={() => setServicingOpen(false)}
          onSave={(saved) => {
            setServicingOpen(false);
            setRereadAsked(true);
            // The first reading becomes "level before"; the checkpoint now waits for the level re-read after the top-up.
            onServicing(saved, servicing ? entry : undefined);
          }}
        />
      );
    }
  }

  /** A one-tap answer: only a finding that is in limits moves on by itself; anything else must be seen first. */
  const answerAndMoveOn = (answer: ReadingEntry) => {
    onEntry(answer);
    const judged = judge(checkpoint, answer, context);
    if (judged.kind === 'verdict' && judged.evaluation.verdict === 'in_limits')
      window.setTimeout(onNext, 250);
  };

  const verdict = (
    <LiveVerdict checkpoint={checkpoint} entry={entry} context={context} unit={unit ?? checkpoint.unit}>
      {need && (
        <Button tone="primary" size="large" onClick={() => setServicingOpen(true)} data-testid="add-fluid">
          {t('checkpoint.addFluid')}
        </Button>
      )}
    </LiveVerdict>
  );
  return (
    <div className="flex flex-col gap-4">
      <div ref={headingRef}>
        <div className="text-[22px] font-semibold uppercase tracking-[0.1em] text-ink-muted">
          {t('checkpoint.heading', { number: index + 1, total, ata: checkpoint.ata })}
        </div>
        <h2 className="text-[36px] font-bold leading-tight">{checkpoint.label}</h2>
        <p className="text-lead">{servicing ? t('checkpoint.reread') : checkpoint.instruction}</p>
      </div>

      {servicing && (
        <div
          data-testid="servicing-summary"
          className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-signal-edge bg-ink-soft p-4"
        >
          <div className="min-w-[260px] flex-1 text-[24px]">
            <div className="font-bold">
              {t('checkpoint.fluidAdded', {
                quantity: words.value(servicing.quantity.value, servicing.quantity.unit),
                spec: servicing.fluidSpec,
                batch: servicing.batch,
              })}
            </div>
            <div className="text-ink-muted">
              {servicing.canOpenedOn
                ? t('checkpoint.canOpened', { day: calendarDay(servicing.canOpenedOn) })
                : t('checkpoint.canOpenedUnknown')}
              {servicing.tool && t('checkpoint.cart', { tool: servicing.tool })}
            </div>
            <div className="text-ink-muted">
              {t('checkpoint.levelBefore', { level: words.entry(servicing.levelBefore) })}
              {expectedAfter !== null &&
                t('checkpoint.expectAfter', { level: words.value(expectedAfter, 'L', 1) })}
            </div>
            {entry === undefined && (
              <div className="font-semibold text-signal-text">{t('checkpoint.tapGlassNow')}</div>
            )}
          </div>
          <Button tone="neutral" onClick={() => setServicingOpen(true)}>
            {t('checkpoint.changeFluid')}
          </Button>
          <Button tone="quiet" onClick={() => onServicing(undefined, servicing.levelBefore)}>
            {t('checkpoint.removeFluid')}
          </Button>
        </div>
      )}

      <div ref={entryRef} className="flex flex-col gap-4">
        {checkpoint.kind === 'level' && marks !== undefined ? (
          <LevelEntry
            checkpoint={{ ...checkpoint, marks }}
            entry={entry}
            onEntry={onEntry}
            verdict={verdict}
          />
        ) : checkpoint.kind === 'leak_rate' ? (
          <LeakRateEntry
            checkpoint={checkpoint}
            entry={entry}
            onNoLeak={() => answerAndMoveOn({ dropsPerMinute: 0 })}
            onEntry={onEntry}
            verdict={verdict}
          />
        ) : checkpoint.kind === 'yes_no' ? (
          <YesNoEntry entry={entry} onAnswer={(answer) => answerAndMoveOn({ answer })} />
        ) : (
          <ValueEntry
            checkpoint={checkpoint}
            entry={entry}
            unit={unit ?? checkpoint.unit ?? 'bar'}
            onEntry={onEntry}
            onUnit={onUnit}
            onClear={() => onEntry(undefined)}
            verdict={verdict}
          />
        )}
        {checkpoint.kind === 'yes_no' && verdict}
      </div>
      {checkpoint.tool && (
        <ToolPicker what={checkpoint.label} rule={checkpoint.tool} value={tool} onChange={onTool} />
      )}
      <PhotoEvidence subject={checkpoint.label} photos={photos} onAdd={onAddPhoto} onRemove={onRemovePhoto} />
      <p className="text-[20px] text-ink-muted">
        {t('checkpoint.limitSource', { reference: checkpoint.reference })}
      </p>

      {/* Back and Next stay under the thumb whatever the screen height. */}
      <BottomBar barRef={barRef}>
        <Button tone="neutral" size="large" onClick={onBack} className="min-w-[200px]">
          {t('nav.back')}
        </Button>
        <Button
          tone="primary"
          size="large"
          disabled={result.kind !== 'verdict' || (checkpoint.tool?.required === true && tool === undefined)}
          onClick={onNext}
          className="flex-1"
        >
          {t('nav.next')}
        </Button>
      </BottomBar>
    </div>
  );
}
