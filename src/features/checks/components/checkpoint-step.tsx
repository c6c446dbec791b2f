import type { Checkpoint, CheckContext, ReadingEntry, Unit } from '../../../../shared/schemas/limits';
import { Button } from '../../../components/ui/button';
import { judge } from '../model/judge';
import { LevelEntry } from './level-entry';
import { LiveVerdict } from './live-verdict';
import { ValueEntry } from './value-entry';
import { YesNoEntry } from './yes-no-entry';

interface CheckpointStepProps {
  checkpoint: Checkpoint;
  index: number;
  total: number;
  entry: ReadingEntry | undefined;
  context: CheckContext;
  unit: Unit | null;
  onEntry: (entry: ReadingEntry | undefined) => void;
  onUnit: (unit: Unit) => void;
  onBack: () => void;
  onNext: () => void;
}

export function CheckpointStep({ checkpoint, index, total, entry, context, unit, onEntry, onUnit, onBack, onNext }: CheckpointStepProps) {
  const result = judge(checkpoint, entry, context);
  const marks = checkpoint.marks;
  const verdict = <LiveVerdict checkpoint={checkpoint} entry={entry} context={context} unit={unit ?? checkpoint.unit} />;
  return (
    <div className="flex flex-col gap-4">
      <div>
        <div className="text-[22px] font-semibold uppercase tracking-[0.1em] text-ink-muted">
          Checkpoint {index + 1} of {total} · ATA {checkpoint.ata}
        </div>
        <h2 className="text-[36px] font-bold leading-tight">{checkpoint.label}</h2>
        <p className="text-lead">{checkpoint.instruction}</p>
      </div>

      {checkpoint.kind === 'level' && marks !== undefined ? (
        <LevelEntry checkpoint={{ ...checkpoint, marks }} entry={entry} onEntry={onEntry} verdict={verdict} />
      ) : checkpoint.kind === 'yes_no' ? (
        <YesNoEntry
          entry={entry}
          onAnswer={(answer) => {
            onEntry({ answer });
            // Only a finding that is in limits moves on by itself; anything else must be seen first.
            const verdict = judge(checkpoint, { answer }, context);
            if (verdict.kind === 'verdict' && verdict.evaluation.verdict === 'in_limits') window.setTimeout(onNext, 250);
          }}
        />
      ) : (
        <ValueEntry checkpoint={checkpoint} entry={entry} unit={unit ?? checkpoint.unit ?? 'bar'} onEntry={onEntry} onUnit={onUnit} onClear={() => onEntry(undefined)} verdict={verdict} />
      )}
      {checkpoint.kind === 'yes_no' && verdict}
      <p className="text-[20px] text-ink-muted">Limit source: {checkpoint.reference}</p>

      {/* Back and Next stay under the thumb whatever the screen height. */}
      <div className="sticky bottom-0 z-30 -mx-6 flex gap-4 border-t-2 border-ink-line bg-ink/95 px-6 py-3">
        <Button tone="neutral" size="large" onClick={onBack} className="min-w-[200px]">
          Back
        </Button>
        <Button tone="primary" size="large" disabled={result.kind !== 'verdict'} onClick={onNext} className="flex-1">
          Next
        </Button>
      </div>
    </div>
  );
}
