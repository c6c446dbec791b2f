import type { Checkpoint, Edge, LimitBand } from '@shared/schemas/limits';
import type { CheckpointDiff, FieldChange, LimitsDiff } from '@shared/schemas/engineering-types';
import type { TFunction } from 'i18next';
import { useTranslation } from 'react-i18next';
import { ChangeTag } from '@/components/desk/desk-ui';
import { checkKindLabel, verdictLabel } from '@shared/schemas/plain';

const edge = (e: Edge | null, side: 'lower' | 'upper') =>
  e === null
    ? side === 'lower'
      ? '−∞'
      : '+∞'
    : `${side === 'lower' ? (e.closed ? '[' : '(') : ''}${e.value}${side === 'upper' ? (e.closed ? ']' : ')') : ''}`;

const bandText = (b: LimitBand, unit: string | null, t: TFunction<'engineeringTypes'>) =>
  `${edge(b.lower, 'lower')} … ${edge(b.upper, 'upper')}${unit ? ` ${unit}` : ''} → ${verdictLabel(b.verdict)}${
    b.when ? t('diff.when', { conditions: Object.values(b.when).join(', ').replaceAll('_', ' ') }) : ''
  }`;

const show = (v: unknown) =>
  v === null || v === undefined ? '—' : typeof v === 'object' ? JSON.stringify(v) : String(v);

function Side({
  checkpoint,
  diff,
  side,
}: {
  checkpoint: Checkpoint | null;
  diff: CheckpointDiff;
  side: 'from' | 'to';
}) {
  const { t } = useTranslation('engineeringTypes');
  if (!checkpoint)
    return (
      <div className="text-ink-muted italic">
        {side === 'from' ? t('diff.notInVersion') : t('diff.removed')}
      </div>
    );
  const changedFields = new Set(diff.fields.map((f) => f.field));
  const marksChanged = changedFields.has('marks');
  const bandChange = new Map(diff.bands.map((b) => [b.id, b.change]));
  return (
    <div className="flex flex-col gap-1">
      <div>
        <span className="font-semibold">{checkpoint.label}</span> ·{' '}
        {t('diff.ataAndUnit', { ata: checkpoint.ata, unit: checkpoint.unit ?? t('diff.yesNo') })}
      </div>
      <div className="text-[15px] text-ink-muted">
        {t('diff.reference', { reference: checkpoint.reference })}
      </div>
      {checkpoint.marks && (
        <div className={marksChanged ? 'font-semibold text-caution-text' : ''}>
          {marksChanged && '~ '}
          {t('diff.marks', {
            minimum: checkpoint.marks.minimum,
            normal: checkpoint.marks.normal,
            maximum: checkpoint.marks.maximum,
          })}
        </div>
      )}
      <ul className="flex flex-col gap-0.5">
        {checkpoint.bands.map((b) => {
          const change = bandChange.get(b.id);
          const mark =
            change === 'changed' ||
            (change === 'added' && side === 'to') ||
            (change === 'removed' && side === 'from');
          return (
            <li key={b.id} className={`font-mono text-[15px] ${mark ? 'rounded bg-ink-raised px-1' : ''}`}>
              {mark && change && <ChangeTag change={change} />} {b.id}: {bandText(b, checkpoint.unit, t)}
            </li>
          );
        })}
      </ul>
    </div>
  );
}

function FieldList({ fields }: { fields: FieldChange[] }) {
  const visible = fields.filter((f) => f.field !== 'marks');
  if (visible.length === 0) return null;
  return (
    <ul className="col-span-2 text-[15px]">
      {visible.map((f) => (
        <li key={f.field}>
          <ChangeTag change="changed" /> <span className="font-semibold">{f.field}</span>: {show(f.from)} →{' '}
          {show(f.to)}
        </li>
      ))}
    </ul>
  );
}

/** Two versions side by side: only what changed, every change marked with a word and a sign. */
export function LimitsDiffView({ diff }: { diff: LimitsDiff }) {
  const { t } = useTranslation('engineeringTypes');
  const statusWord = (status: string) =>
    status === 'draft' || status === 'published' ? t(`status.${status}`) : status;
  const nothing = diff.checkpoints.length === 0 && diff.cards.length === 0 && diff.type.length === 0;
  return (
    <div className="flex flex-col gap-3" data-testid="limits-diff">
      <div className="grid grid-cols-2 gap-4 border-b-2 border-ink-line pb-1 font-bold">
        <div>{t('diff.version', { version: diff.from.version, status: statusWord(diff.from.status) })}</div>
        <div>{t('diff.version', { version: diff.to.version, status: statusWord(diff.to.status) })}</div>
      </div>
      {nothing && <p>{t('diff.none')}</p>}
      {diff.type.length > 0 && (
        <div className="grid grid-cols-2 gap-4">
          <FieldList fields={diff.type} />
        </div>
      )}
      {diff.cards.map((c) => (
        <div key={c.kind} className="grid grid-cols-2 gap-4 rounded-lg border border-ink-line p-2">
          <div>
            <ChangeTag change="changed" />{' '}
            {t('diff.card', { kind: checkKindLabel(c.kind), codes: c.from.join(', ') || '—' })}
          </div>
          <div>{c.to.join(', ') || '—'}</div>
        </div>
      ))}
      {diff.checkpoints.map((c) => (
        <div key={c.code} className="grid grid-cols-2 gap-4 rounded-lg border border-ink-line p-2">
          <div className="col-span-2 flex items-center gap-2">
            <ChangeTag change={c.change} /> <span>{c.label}</span>
          </div>
          <Side checkpoint={c.from} diff={c} side="from" />
          <Side checkpoint={c.to} diff={c} side="to" />
          <FieldList fields={c.fields} />
        </div>
      ))}
    </div>
  );
}
