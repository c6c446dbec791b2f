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

interface ActProps {
  defect: DefectView;
  channel: SigningChannel;
  onDone: () => void;
}

const firstIssue = (error: { issues: { message: string }[] }, fallback: string) =>
  error.issues[0]?.message ?? fallback;

export function WorkForm({ defect, channel, onDone }: ActProps) {
  const work = useRecordDefectWork(defect.id);
  const [action, setAction] = useState('');
  const [inspection, setInspection] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <SignedActForm
      channel={channel}
      title={`Record the work on defect ${defect.number}`}
      submitLabel="Sign the work done"
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
          setProblem(firstIssue(parsed.error, 'Check the work.'));
          return false;
        }
        setProblem(null);
        work.mutate(parsed.data, { onSuccess: onDone });
        return true;
      }}
    >
      <TextBox
        label="What was done"
        value={action}
        onChange={setAction}
        multiline
        placeholder="e.g. Replaced the case drain seal, leak-checked at system pressure: no leak."
      />
      <BigCheckbox checked={inspection} onChange={setInspection} testId="work-needs-inspection">
        <strong>Flight controls or another system was disturbed:</strong> a second person must inspect before
        it is certified.
      </BigCheckbox>
    </SignedActForm>
  );
}

export function InspectionForm({ defect, channel, onDone }: ActProps) {
  const inspect = useRecordDefectInspection(defect.id);
  const [statement, setStatement] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <SignedActForm
      channel={channel}
      title={`Independent inspection of defect ${defect.number}`}
      intro="A second person inspects the work; whoever did the work cannot sign this."
      submitLabel="Sign the independent inspection"
      isPending={inspect.isPending}
      error={inspect.error}
      problem={problem}
      testId="defect-inspection"
      onSubmit={(secret) => {
        const parsed = inspectionSchema.safeParse({ statement, ...secretFor(channel, secret) });
        if (!parsed.success) {
          setProblem(firstIssue(parsed.error, 'Check the inspection.'));
          return false;
        }
        setProblem(null);
        inspect.mutate(parsed.data, { onSuccess: onDone });
        return true;
      }}
    >
      <TextBox label="What you inspected" value={statement} onChange={setStatement} multiline />
    </SignedActForm>
  );
}

export function CertifyForm({ defect, channel, onDone }: ActProps) {
  const certify = useCertifyDefect(defect.id);
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <SignedActForm
      channel={channel}
      title={`Certify the rectification of defect ${defect.number}`}
      intro={
        <>
          You certify that the work recorded on defect {defect.number} was carried out in accordance with the
          approved maintenance data. It is signed under your certifying authorisation for{' '}
          {defect.airframe.typeCode}; nobody certifies their own work.
        </>
      }
      submitLabel="Sign the certification"
      tone="go"
      isPending={certify.isPending}
      error={certify.error}
      problem={problem}
      testId="defect-certify"
      onSubmit={(secret) => {
        const parsed = certifySchema.safeParse(secretFor(channel, secret));
        if (!parsed.success) {
          setProblem(firstIssue(parsed.error, 'Type your PIN or password.'));
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
  return days === null ? 'as the MEL item says' : `${days} calendar days`;
};

const numberOrNull = (text: string) => (text.trim() === '' ? null : Number(text.replace(',', '.')));

export function DeferForm({ defect, channel, onDone }: ActProps) {
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
      title={`Defer defect ${defect.number}`}
      intro={`Under an MEL item or the operator's deferred-defect procedure, within its category's limit. Signed under your certifying authorisation for ${defect.airframe.typeCode}.`}
      submitLabel="Sign the deferral"
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
            message: issue ? issue.message : 'Check the deferral.',
          });
          return false;
        }
        setProblem(null);
        defer.mutate(parsed.data, { onSuccess: onDone });
        return true;
      }}
    >
      <TextBox
        label="MEL item or procedure reference"
        value={reference}
        onChange={setReference}
        invalid={field === 'reference'}
        placeholder="e.g. MEL 29-10-02"
      />
      <div className="flex flex-col gap-2">
        <span className="text-[22px] font-semibold">Category</span>
        <div
          className="grid grid-cols-4 gap-2 portrait:grid-cols-2"
          role="radiogroup"
          aria-label="Category"
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
          label="Last day (optional)"
          type="date"
          value={untilDay}
          onChange={setUntilDay}
          invalid={field === 'untilDay'}
          hint="At most the category's limit"
        />
        <TextBox
          label="Flight hours (optional)"
          value={hours}
          onChange={setHours}
          inputMode="decimal"
          invalid={field === 'hours'}
        />
        <TextBox
          label="Flights (optional)"
          value={flights}
          onChange={setFlights}
          inputMode="numeric"
          invalid={field === 'flights'}
        />
      </div>
      <TextBox
        label="Repeat inspection (optional)"
        value={repeat}
        onChange={setRepeat}
        invalid={field === 'repeatInspection'}
        placeholder="e.g. Check the pump case drain for leaks before each first flight of the day."
      />
    </SignedActForm>
  );
}
