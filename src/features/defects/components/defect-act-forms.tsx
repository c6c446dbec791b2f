import i18next from 'i18next';
import { typedDecimal } from '@/lib/typed-number';
import { useState } from 'react';
import {
  certifySchema,
  deferDefectSchema,
  defectWorkSchema,
  inspectionSchema,
  type DefectView,
} from '@shared/schemas/defects';
import { categoryDays, deferralCategories, type DeferralCategory } from '@shared/domain/deferral';
import { BigCheckbox } from '@/components/ui/big-checkbox';
import { secretFor, type SigningChannel } from '@/components/ui/signature-entry';
import { useCertifyDefect } from '../api/certify-defect';
import { useDeferDefect } from '../api/defer-defect';
import { useRecordDefectInspection } from '../api/record-defect-inspection';
import { useRecordDefectWork } from '../api/record-defect-work';
import { refusedField, SignedActForm, TextBox } from './signed-act-form';
import { useTranslation } from 'react-i18next';
import { fieldError } from '@/lib/field-error';

interface ActProps {
  defect: DefectView;
  channel: SigningChannel;
  onDone: () => void;
}

const firstIssue = (error: { issues: { message: string }[] }, fallback: string) =>
  fieldError(error.issues[0]?.message) ?? fallback;

export function WorkForm({ defect, channel, onDone }: ActProps) {
  const { t } = useTranslation('defects');
  const work = useRecordDefectWork(defect.id);
  const [action, setAction] = useState('');
  const [inspection, setInspection] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <SignedActForm
      channel={channel}
      title={t('work.title', { number: defect.number })}
      submitLabel={t('work.submit')}
      isPending={work.isPending}
      error={work.error}
      problem={problem}
      testId="defect-work"
      onSubmit={(secret) => {
        const parsed = defectWorkSchema.safeParse({
          action,
          independentInspection: inspection,
          ...secretFor(channel, secret),
        });
        if (!parsed.success) {
          setProblem(firstIssue(parsed.error, t('work.check')));
          return false;
        }
        setProblem(null);
        work.mutate(parsed.data, { onSuccess: onDone });
        return true;
      }}
    >
      <TextBox
        label={t('work.what')}
        value={action}
        onChange={setAction}
        multiline
        placeholder={t('work.placeholder')}
      />
      <BigCheckbox checked={inspection} onChange={setInspection} testId="work-needs-inspection">
        <strong>{t('work.disturbed')}</strong> {t('work.disturbedText')}
      </BigCheckbox>
    </SignedActForm>
  );
}

export function InspectionForm({ defect, channel, onDone }: ActProps) {
  const { t } = useTranslation('defects');
  const inspect = useRecordDefectInspection(defect.id);
  const [statement, setStatement] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <SignedActForm
      channel={channel}
      title={t('inspect.title', { number: defect.number })}
      intro={t('inspect.intro')}
      submitLabel={t('inspect.submit')}
      isPending={inspect.isPending}
      error={inspect.error}
      problem={problem}
      testId="defect-inspection"
      onSubmit={(secret) => {
        const parsed = inspectionSchema.safeParse({ statement, ...secretFor(channel, secret) });
        if (!parsed.success) {
          setProblem(firstIssue(parsed.error, t('inspect.check')));
          return false;
        }
        setProblem(null);
        inspect.mutate(parsed.data, { onSuccess: onDone });
        return true;
      }}
    >
      <TextBox label={t('inspect.what')} value={statement} onChange={setStatement} multiline />
    </SignedActForm>
  );
}

export function CertifyForm({ defect, channel, onDone }: ActProps) {
  const { t } = useTranslation('defects');
  const certify = useCertifyDefect(defect.id);
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <SignedActForm
      channel={channel}
      title={t('certify.title', { number: defect.number })}
      intro={t('certify.intro', { number: defect.number, type: defect.airframe.typeCode })}
      submitLabel={t('certify.submit')}
      tone="go"
      isPending={certify.isPending}
      error={certify.error}
      problem={problem}
      testId="defect-certify"
      onSubmit={(secret) => {
        const parsed = certifySchema.safeParse(secretFor(channel, secret));
        if (!parsed.success) {
          setProblem(firstIssue(parsed.error, t('certify.typeSecret')));
          return false;
        }
        setProblem(null);
        certify.mutate(parsed.data, { onSuccess: onDone });
        return true;
      }}
    />
  );
}

// MMEL/MEL rectification intervals as commonly published (from memory): days after the day of discovery.
const categoryWords = (category: DeferralCategory) => {
  const days = categoryDays[category];
  return days === null
    ? i18next.t('defer.asMel', { ns: 'defects' })
    : i18next.t('defer.days', { ns: 'defects', count: days });
};

const numberOrNull = (text: string) => typedDecimal(text) ?? null;

export function DeferForm({ defect, channel, onDone }: ActProps) {
  const { t } = useTranslation('defects');
  const defer = useDeferDefect(defect.id);
  const [reference, setReference] = useState('');
  const [category, setCategory] = useState<DeferralCategory | null>(null);
  const [untilDay, setUntilDay] = useState('');
  const [hours, setHours] = useState('');
  const [flights, setFlights] = useState('');
  const [repeat, setRepeat] = useState('');
  const [problem, setProblem] = useState<{ field: string | null; message: string } | null>(null);
  const field = problem?.field ?? refusedField(defer.error);
  return (
    <SignedActForm
      channel={channel}
      title={t('defer.title', { number: defect.number })}
      intro={t('defer.intro', { type: defect.airframe.typeCode })}
      submitLabel={t('defer.submit')}
      isPending={defer.isPending}
      error={defer.error}
      problem={problem?.message ?? null}
      testId="defect-defer"
      onSubmit={(secret) => {
        const parsed = deferDefectSchema.safeParse({
          reference,
          category,
          untilDay: untilDay === '' ? null : untilDay,
          hours: numberOrNull(hours),
          flights: numberOrNull(flights),
          ...(repeat.trim() ? { repeatInspection: repeat } : {}),
          ...secretFor(channel, secret),
        });
        if (!parsed.success) {
          const issue = parsed.error.issues[0];
          setProblem({
            field: issue ? String(issue.path[0] ?? '') : null,
            message: issue ? fieldError(issue.message) : t('defer.check'),
          });
          return false;
        }
        setProblem(null);
        defer.mutate(parsed.data, { onSuccess: onDone });
        return true;
      }}
    >
      <TextBox
        label={t('defer.reference')}
        value={reference}
        onChange={setReference}
        invalid={field === 'reference'}
        placeholder={t('defer.referencePlaceholder')}
      />
      <div className="flex flex-col gap-2">
        <span className="text-[22px] font-semibold">{t('defer.category')}</span>
        <div
          className="grid grid-cols-4 gap-2 portrait:grid-cols-2"
          role="radiogroup"
          aria-label={t('defer.category')}
          aria-invalid={field === 'category' || undefined}
        >
          {deferralCategories.map((c) => (
            <button
              key={c}
              type="button"
              role="radio"
              aria-checked={category === c}
              onClick={() => setCategory(c)}
              className={`flex min-h-touch flex-col items-start justify-center rounded-xl border-2 px-3 text-left leading-tight ${category === c ? 'border-signal-edge bg-signal-bright text-on-fill' : 'border-ink-line bg-ink-raised text-paper'}`}
            >
              <span className="text-[28px] font-bold">{c}</span>
              <span className="text-[18px]">{categoryWords(c)}</span>
            </button>
          ))}
        </div>
      </div>
      <div className="grid gap-3 sm:grid-cols-3">
        <TextBox
          label={t('defer.lastDay')}
          type="date"
          value={untilDay}
          onChange={setUntilDay}
          invalid={field === 'untilDay'}
          hint={t('defer.lastDayHint')}
        />
        <TextBox
          label={t('defer.hours')}
          value={hours}
          onChange={setHours}
          inputMode="decimal"
          invalid={field === 'hours'}
        />
        <TextBox
          label={t('defer.flights')}
          value={flights}
          onChange={setFlights}
          inputMode="numeric"
          invalid={field === 'flights'}
        />
      </div>
      <TextBox
        label={t('defer.repeat')}
        value={repeat}
        onChange={setRepeat}
        invalid={field === 'repeatInspection'}
        placeholder={t('defer.repeatPlaceholder')}
      />
    </SignedActForm>
  );
}
