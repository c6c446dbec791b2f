import i18next from 'i18next';
import type { english } from '@shared/i18n/english';
import { localNumber } from '@shared/domain/words';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { DefectEntryView, DefectView } from '@shared/schemas/defects';
import { ataChapterWords, authorisationWords } from '@shared/domain/authorisation';
import { recordTime } from '@/lib/when';
import { Button } from '@/components/ui/button';
import { ShapeIcon, type Shape } from '@/components/ui/shapes';
import type { SigningChannel } from '@/components/ui/signature-entry';
import { CertifyForm, DeferForm, InspectionForm, WorkForm } from './defect-act-forms';
import { useTranslation } from 'react-i18next';
import { phraseWords } from '@shared/i18n/phrase';

/** Every key of a catalogue, dotted: "card.status.open". */
type Paths<T, P extends string = ''> = {
  [K in keyof T & string]: T[K] extends string ? `${P}${K}` : Paths<T[K], `${P}${K}.`>;
}[keyof T & string];
/** A key of the defects catalogue. */
type DefectsKey = Paths<(typeof english)['defects']>;

const statusLook: Record<
  DefectView['status'],
  { shape: Shape; word: DefectsKey; tone: string; edge: string }
> = {
  open: {
    shape: 'octagon',
    word: 'card.status.open',
    tone: 'text-warning-text',
    edge: 'border-l-warning-edge',
  },
  deferral_expired: {
    shape: 'octagon',
    word: 'card.status.expired',
    tone: 'text-warning-text',
    edge: 'border-l-warning-edge',
  },
  deferred: {
    shape: 'triangle',
    word: 'card.status.deferred',
    tone: 'text-caution-text',
    edge: 'border-l-caution-edge',
  },
  rectified: {
    shape: 'circle-check',
    word: 'card.status.rectified',
    tone: 'text-normal-text',
    edge: 'border-l-normal',
  },
};

const sourceWords: Record<DefectView['source'], DefectsKey> = {
  finding: 'card.source.finding',
  check_note: 'card.source.checkNote',
  raised: 'card.source.raised',
};

const entryWords: Record<DefectEntryView['kind'], DefectsKey> = {
  work: 'card.entry.work',
  inspection: 'card.entry.inspection',
  certification: 'card.entry.certification',
  deferral: 'card.entry.deferral',
};

/** A defects-namespace key, said in the screen's language. */
const say = (key: DefectsKey, values?: Record<string, unknown>) =>
  i18next.t(key, { ns: 'defects', ...values });

export const chapterName = (chapter: string | null) =>
  chapter === null ? say('card.noChapter') : ataChapterWords(chapter);

function deferralDetails(entry: DefectEntryView): string {
  const limits = [
    entry.limitAt ? say('card.untilAt', { at: recordTime(entry.limitAt) }) : null,
    entry.limitHours !== null ? say('card.untilHours', { hours: localNumber(entry.limitHours, 1) }) : null,
    entry.limitFlights !== null ? say('card.untilFlight', { flight: entry.limitFlights }) : null,
  ].filter(Boolean);
  return say('card.deferral', {
    category: entry.category ?? '?',
    reference: entry.reference ?? say('card.noReference'),
    limits: limits.join(say('card.or')),
  });
}

function EntryLine({ entry }: { entry: DefectEntryView }) {
  const { t } = useTranslation('defects');
  return (
    <li className="flex flex-col gap-1 rounded-xl border-2 border-ink-line bg-ink p-3 text-[22px]">
      <strong>{t(entryWords[entry.kind])}</strong>
      {entry.kind === 'deferral' && <span>{deferralDetails(entry)}</span>}
      {entry.text && (
        <span className="whitespace-pre-wrap break-words">
          {entry.kind === 'deferral' ? t('card.repeat', { text: entry.text }) : entry.text}
        </span>
      )}
      {entry.independentInspection && <span className="text-caution-text">{t('card.disturbed')}</span>}
      <span className="text-[20px] text-ink-muted">
        {entry.signedBy.name}
        {entry.signedBy.licenceNumber
          ? t('card.licence', { licence: entry.signedBy.licenceNumber })
          : ''} · {recordTime(entry.signedAt)}
        {entry.authorisation
          ? t('card.under', { authorisation: authorisationWords(entry.authorisation) })
          : ''}
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
  const { t } = useTranslation('defects');
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
        <h3 className="text-[30px] font-bold">{t('card.defect', { number: defect.number })}</h3>
        <span className={`inline-flex items-center gap-2 text-[24px] font-bold ${look.tone}`}>
          <ShapeIcon shape={look.shape} size={28} />
          {t(look.word)}
        </span>
      </header>
      <p
        className="whitespace-pre-wrap break-words text-[26px] font-semibold leading-snug"
        data-recorded-words
      >
        {defect.description}
      </p>
      <p className="text-[20px] text-ink-muted">
        {t(sourceWords[defect.source])} {t('card.by', { name: defect.raisedBy.name })},{' '}
        {recordTime(defect.raisedAt)} · {chapterName(defect.chapter)}
        {defect.needsIndependentInspection ? t('card.needsInspection') : ''}
      </p>
      <p className={`text-[22px] font-semibold ${look.tone}`} data-testid="defect-reason">
        {phraseWords(defect.reason)}
      </p>
      {defect.entries.length > 0 && (
        <ol className="flex flex-col gap-2" aria-label={t('card.entries', { number: defect.number })}>
          {defect.entries.map((entry) => (
            <EntryLine key={entry.id} entry={entry} />
          ))}
        </ol>
      )}
      {defect.holdId !== null && defect.status !== 'rectified' && (
        <div className="flex flex-wrap items-center gap-4 text-[22px]">
          <span>{t('card.ofHold')}</span>
          <Link
            className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-5 font-semibold"
            to={holdHref(defect.holdId)}
          >
            {t('card.openHold')}
          </Link>
        </div>
      )}
      {actable && (
        <div
          className="flex flex-wrap gap-3"
          role="group"
          aria-label={t('card.act', { number: defect.number })}
        >
          {choice('work', t('card.recordWork'))}
          {needsInspection && hasWork && choice('inspection', t('card.inspection'))}
          {hasWork && choice('certify', t('card.certify'))}
          {choice('defer', t('card.defer'))}
        </div>
      )}
      {actable && act === 'work' && <WorkForm {...props} />}
      {actable && act === 'inspection' && <InspectionForm {...props} />}
      {actable && act === 'certify' && <CertifyForm {...props} />}
      {actable && act === 'defer' && <DeferForm {...props} />}
    </article>
  );
}
