import type { ReactNode } from 'react';
import type { Checkpoint, CheckContext, ReadingEntry, Unit } from '@shared/schemas/limits';
import { expectedPrecharge } from '@shared/domain/accumulator';
import { leakReadingWords } from '@shared/domain/leak-rate';
import { fluidToAdd, targetMark } from '@shared/domain/servicing';
import { convert, formatValue, isPressureUnit } from '@shared/domain/units';
import { Notice } from '@/components/ui/notice';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { judge } from '../model/judge';

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
  const show = (value: number) => formatValue(convert(value, canonical, shownUnit), shownUnit);
  return (
    <p data-testid="expected-precharge" className="text-[24px]">
      Expected at {context.ambientTempC.toFixed(1)} °C:{' '}
      <strong className="text-[30px]">{show(expected)}</strong> (±{show(precharge.tolerance)}), corrected from{' '}
      {show(precharge.referencePressure)} at {precharge.referenceTempC} °C.
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
  if (checkpoint.kind !== 'level' || !('value' in entry) || checkpoint.unit === null) return null;
  try {
    const litres = fluidToAdd({
      checkpoint,
      currentLevelL: convert(entry.value, entry.unit, 'L'),
      ...(context.attitude ? { attitude: context.attitude } : {}),
    });
    if (litres <= 0) return null;
    const mark =
      targetMark(checkpoint, context.attitude).mark === 'maximum' ? 'maintenance (upper)' : 'normal';
    // Most glasses carry marks, not a scale: the figure is a guide to the pour, and the glass re-read decides.
    return (
      <p data-testid="fluid-to-add" className="text-[24px]">
        About <strong className="text-[30px]">{formatValue(litres, 'L', 1)}</strong> to the {mark} mark — an
        estimate; add and re-read the glass.
      </p>
    );
  } catch {
    return null;
  }
}

/** The verdict the moment a value is set, from the same engine the server signs with. */
export function LiveVerdict({ checkpoint, entry, context, unit, children }: LiveVerdictProps) {
  const result = judge(checkpoint, entry, context);
  return (
    <section
      aria-live="polite"
      aria-label="Verdict"
      className="flex min-h-[120px] flex-col gap-3 rounded-xl border-2 border-ink-line bg-ink-soft p-4"
    >
      <ExpectedPrecharge checkpoint={checkpoint} context={context} unit={unit} />
      {result.kind === 'empty' && (
        <p className="text-lead text-ink-muted">No reading yet. The verdict shows as soon as you set one.</p>
      )}
      {result.kind === 'invalid' && (
        <Notice tone="caution" title="Cannot judge this reading">
          {result.message}
        </Notice>
      )}
      {result.kind === 'verdict' && (
        <>
          {entry && 'dropsPerMinute' in entry && (
            <p data-testid="leak-words" className="text-[30px] font-bold leading-tight">
              {leakReadingWords(entry, result.evaluation.verdict)}
            </p>
          )}
          <div className="flex flex-wrap items-center gap-4">
            <VerdictBadge verdict={result.evaluation.verdict} size="lg" />
            <span className="text-[28px] font-semibold leading-tight">{result.evaluation.message}</span>
          </div>
          {result.evaluation.action !== 'None.' && (
            <p className="text-[24px]">
              <span className="font-semibold uppercase tracking-wide text-ink-muted">Next: </span>
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
