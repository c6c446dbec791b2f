import type { ReactNode } from 'react';
import type { Checkpoint, CheckContext, ReadingEntry, Unit } from '@shared/schemas/limits';
import { expectedPrecharge } from '@shared/domain/accumulator';
import { fluidToAdd, targetMark } from '@shared/domain/servicing';
import { convert, isPressureUnit } from '@shared/domain/units';
import { Notice } from '@/components/ui/notice';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { judge } from '../model/judge';
import { Trans } from 'react-i18next';
import { useCheckWords } from '../model/check-words';

interface LiveVerdictProps {
  checkpoint: Checkpoint;
  entry: ReadingEntry | undefined;
  context: CheckContext;
  /** The unit the mechanic reads in, for the expected pre-charge. */
  unit: Unit | null;
  /** What the mechanic can do about it right here (for example "Add fluid"). */
  children?: ReactNode;
}

function ExpectedPrecharge({
  checkpoint,
  context,
  unit,
}: {
  checkpoint: Checkpoint;
  context: CheckContext;
  unit: Unit | null;
}) {
  const { t, words } = useCheckWords();
  const precharge = checkpoint.precharge;
  const canonical = checkpoint.unit;
  if (!precharge || !canonical || !isPressureUnit(canonical) || context.ambientTempC === undefined)
    return null;
  const expected = expectedPrecharge({
    referencePressure: precharge.referencePressure,
    referenceTemp: precharge.referenceTempC,
    ambientTemp: context.ambientTempC,
    unit: canonical,
  });
  const shownUnit = unit ?? canonical;
  const show = (value: number) => words.value(convert(value, canonical, shownUnit), shownUnit);
  return (
    <p data-testid="expected-precharge" className="text-[24px]">
      <Trans
        t={t}
        i18nKey="verdict.expectedPrecharge"
        values={{
          temp: words.number(context.ambientTempC, 1),
          expected: show(expected),
          tolerance: show(precharge.tolerance),
          reference: show(precharge.referencePressure),
          referenceTemp: words.number(
            precharge.referenceTempC,
            String(precharge.referenceTempC).split('.')[1]?.length ?? 0,
          ),
        }}
        components={{ strong: <strong className="text-[30px]" /> }}
      />
    </p>
  );
}

function FluidToAdd({
  checkpoint,
  entry,
  context,
}: {
  checkpoint: Checkpoint;
  entry: ReadingEntry;
  context: CheckContext;
}) {
  const { t, words } = useCheckWords();
  if (checkpoint.kind !== 'level' || !('value' in entry) || checkpoint.unit === null) return null;
  try {
    const litres = fluidToAdd({
      checkpoint,
      currentLevelL: convert(entry.value, entry.unit, 'L'),
      ...(context.attitude ? { attitude: context.attitude } : {}),
    });
    if (litres <= 0) return null;
    const mark =
      targetMark(checkpoint, context.attitude).mark === 'maximum'
        ? t('marks.maximum')
        : t('marks.normalInSentence');
    // Most glasses carry marks, not a scale: the figure is a guide to the pour, and the glass re-read decides.
    return (
      <p data-testid="fluid-to-add" className="text-[24px]">
        <Trans
          t={t}
          i18nKey="verdict.toAdd"
          values={{ amount: words.value(litres, 'L', 1), mark }}
          components={{ strong: <strong className="text-[30px]" /> }}
        />
      </p>
    );
  } catch {
    return null;
  }
}

/** The verdict the moment a value is set, from the same engine the server signs with. */
export function LiveVerdict({ checkpoint, entry, context, unit, children }: LiveVerdictProps) {
  const { t, words } = useCheckWords();
  const result = judge(checkpoint, entry, context);
  return (
    <section
      aria-live="polite"
      aria-label={t('verdict.label')}
      className="flex min-h-[120px] flex-col gap-3 rounded-xl border-2 border-ink-line bg-ink-soft p-4"
    >
      <ExpectedPrecharge checkpoint={checkpoint} context={context} unit={unit} />
      {result.kind === 'empty' && <p className="text-lead text-ink-muted">{t('verdict.noReading')}</p>}
      {result.kind === 'invalid' && (
        <Notice tone="caution" title={t('verdict.cannotJudge')}>
          {result.message}
        </Notice>
      )}
      {result.kind === 'verdict' && (
        <>
          {entry && 'dropsPerMinute' in entry && (
            <p data-testid="leak-words" className="text-[30px] font-bold leading-tight">
              {words.reading(entry, result.evaluation.verdict)}
            </p>
          )}
          <div className="flex flex-wrap items-center gap-4">
            <VerdictBadge verdict={result.evaluation.verdict} size="lg" />
            <span className="text-[28px] font-semibold leading-tight">{result.evaluation.message}</span>
          </div>
          {result.evaluation.action !== 'None.' && (
            <p className="text-[24px]">
              <span className="font-semibold uppercase tracking-wide text-ink-muted">
                {t('verdict.next')}
              </span>
              {result.evaluation.action}
            </p>
          )}
          {/* Out of limits is a hold, not a top-up: the amount is shown only for a level that may be serviced here. */}
          {entry && result.evaluation.verdict !== 'out_of_limits' && (
            <FluidToAdd checkpoint={checkpoint} entry={entry} context={context} />
          )}
        </>
      )}
      {children}
    </section>
  );
}
