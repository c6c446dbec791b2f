import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { DefectEntryView, DefectView } from '@shared/schemas/defects';
import { ataChapters, type AtaScope } from '@shared/domain/authorisation';
import { recordTime } from '@/lib/when';
import { Button } from '@/components/ui/button';
import { ShapeIcon, type Shape } from '@/components/ui/shapes';
import type { SigningChannel } from '@/components/ui/signature-entry';
import { CertifyForm, DeferForm, InspectionForm, WorkForm } from './defect-act-forms';

const statusLook: Record<DefectView['status'], { shape: Shape; word: string; tone: string; edge: string }> = {
  open: { shape: 'octagon', word: 'Open', tone: 'text-warning-text', edge: 'border-l-warning-edge' },
  deferral_expired: {
    shape: 'octagon',
    word: 'Deferral expired',
    tone: 'text-warning-text',
    edge: 'border-l-warning-edge',
  },
  deferred: {
    shape: 'triangle',
    word: 'Deferred',
    tone: 'text-caution-text',
    edge: 'border-l-caution-edge',
  },
  rectified: { shape: 'circle-check', word: 'Rectified', tone: 'text-normal-text', edge: 'border-l-normal' },
};

const sourceWords: Record<DefectView['source'], string> = {
  finding: 'from a reading out of limits',
  check_note: 'from the defect note on a check',
  raised: 'raised',
};

const entryWords: Record<DefectEntryView['kind'], string> = {
  work: 'Work done',
  inspection: 'Independent inspection',
  certification: 'Rectification certified',
  deferral: 'Deferred',
};

export const chapterName = (chapter: string | null) =>
  chapter === null ? 'no ATA chapter given' : (ataChapters[chapter as AtaScope] ?? `ATA ${chapter}`);

function deferralDetails(entry: DefectEntryView): string {
  const limits = [
    entry.limitAt ? `until ${recordTime(entry.limitAt)}` : null,
    entry.limitHours !== null ? `until ${entry.limitHours.toFixed(1)} airframe hours` : null,
    entry.limitFlights !== null ? `until flight ${entry.limitFlights}` : null,
  ].filter(Boolean);
  return `Category ${entry.category ?? '?'} under ${entry.reference ?? 'no reference'}, ${limits.join(' or ')}`;
}

function EntryLine({ entry }: { entry: DefectEntryView }) {
  return (
    <li className="flex flex-col gap-1 rounded-xl border-2 border-ink-line bg-ink p-3 text-[22px]">
      <strong>{entryWords[entry.kind]}</strong>
      {entry.kind === 'deferral' && <span>{deferralDetails(entry)}</span>}
      {entry.text && (
        <span className="whitespace-pre-wrap break-words">
          {entry.kind === 'deferral' ? `Repeat inspection: ${entry.text}` : entry.text}
        </span>
      )}
      {entry.independentInspection && (
        <span className="text-caution-text">Disturbed a system: needs an independent inspection</span>
      )}
      <span className="text-[20px] text-ink-muted">
        {entry.signedBy.name}
        {entry.signedBy.licenceNumber ? ` (licence ${entry.signedBy.licenceNumber})` : ''} ·{' '}
        {recordTime(entry.signedAt)}
        {entry.authorisation ? ` · under ${entry.authorisation}` : ''}
      </span>
    </li>
  );
}

type Act = 'work' | 'inspection' | 'certify' | 'defer';

/** One defect of the tech log: what was found, its standing in words, every signed entry, and the next acts. */
export function DefectCard({
  defect,
  channel,
  canAct,
  holdHref,
}: {
  defect: DefectView;
  channel: SigningChannel;
  canAct: boolean;
  holdHref: (holdId: number) => string;
}) {
  const [act, setAct] = useState<Act | null>(null);
  const look = statusLook[defect.status];
  const needsInspection =
    defect.needsIndependentInspection ||
    defect.entries.some((e) => e.kind === 'work' && e.independentInspection);
  const hasWork = defect.entries.some((e) => e.kind === 'work');
  const actable = canAct && defect.status !== 'rectified' && defect.holdId === null;
  const choice = (which: Act, label: string) => (
    <Button
      key={which}
      tone={act === which ? 'primary' : 'neutral'}
      aria-pressed={act === which}
      onClick={() => setAct(act === which ? null : which)}
    >
      {label}
    </Button>
  );
  const props = { defect, channel, onDone: () => setAct(null) };
  return (
    <article
      data-testid={`tech-log-defect-${defect.number}`}
      data-status={defect.status}
      className={`flex flex-col gap-3 rounded-2xl border-2 border-l-[12px] border-ink-line bg-ink-soft p-4 ${look.edge}`}
    >
      <header className="flex flex-wrap items-center gap-x-4 gap-y-1">
        <h3 className="text-[30px] font-bold">Defect {defect.number}</h3>
        <span className={`inline-flex items-center gap-2 text-[24px] font-bold ${look.tone}`}>
          <ShapeIcon shape={look.shape} size={28} />
          {look.word}
        </span>
      </header>
      <p className="whitespace-pre-wrap break-words text-[26px] font-semibold leading-snug">
        {defect.description}
      </p>
      <p className="text-[20px] text-ink-muted">
        {sourceWords[defect.source]} by {defect.raisedBy.name}, {recordTime(defect.raisedAt)} ·{' '}
        {chapterName(defect.chapter)}
        {defect.needsIndependentInspection ? ' · needs an independent inspection' : ''}
      </p>
      <p className={`text-[22px] font-semibold ${look.tone}`} data-testid="defect-reason">
        {defect.reason}
      </p>
      {defect.entries.length > 0 && (
        <ol className="flex flex-col gap-2" aria-label={`Entries of defect ${defect.number}`}>
          {defect.entries.map((entry) => (
            <EntryLine key={entry.id} entry={entry} />
          ))}
        </ol>
      )}
      {defect.holdId !== null && defect.status !== 'rectified' && (
        <div className="flex flex-wrap items-center gap-4 text-[22px]">
          <span>This is the finding of a hold: it clears with the hold's countersigned release.</span>
          <Link
            className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-5 font-semibold"
            to={holdHref(defect.holdId)}
          >
            Open the hold
          </Link>
        </div>
      )}
      {actable && (
        <div className="flex flex-wrap gap-3" role="group" aria-label={`Act on defect ${defect.number}`}>
          {choice('work', 'Record work')}
          {needsInspection && hasWork && choice('inspection', 'Independent inspection')}
          {hasWork && choice('certify', 'Certify rectification')}
          {choice('defer', 'Defer')}
        </div>
      )}
      {actable && act === 'work' && <WorkForm {...props} />}
      {actable && act === 'inspection' && <InspectionForm {...props} />}
      {actable && act === 'certify' && <CertifyForm {...props} />}
      {actable && act === 'defer' && <DeferForm {...props} />}
    </article>
  );
}
