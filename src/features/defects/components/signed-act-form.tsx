import { useTranslation } from 'react-i18next';
import { useState, type ReactNode } from 'react';
import { ApiRequestError, errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SignatureEntry, type SigningChannel } from '@/components/ui/signature-entry';

/** The field a server refusal names (`field` on a refused deferral, or the first zod issue), if any. */
export function refusedField(error: unknown): string | null {
  if (!(error instanceof ApiRequestError)) return null;
  if (typeof error.body.field === 'string') return error.body.field;
  return error.body.issues?.[0]?.path.split('.')[0] ?? null;
}

/**
 * One signed tech-log act: its fields, the signer's PIN or password typed again, and the server's answer shown in
 * place. What was typed stays after a refusal; only the secret is cleared once it has been sent.
 */
export function SignedActForm({
  channel,
  title,
  intro,
  submitLabel,
  isPending,
  error,
  problem,
  onSubmit,
  children,
  testId,
  tone = 'primary',
  onCancel,
}: {
  channel: SigningChannel;
  title: ReactNode;
  intro?: ReactNode;
  submitLabel: string;
  isPending: boolean;
  error: unknown;
  /** A problem found before sending (the same zod schema the server uses). */
  problem: string | null;
  /** Sends the act; returns false when the input was refused before sending. */
  onSubmit: (secret: string) => boolean;
  children?: ReactNode;
  testId: string;
  tone?: 'primary' | 'go';
  onCancel?: () => void;
}) {
  const { t } = useTranslation('defects');
  const [secret, setSecret] = useState('');
  const submit = () => {
    if (isPending || secret === '') return;
    if (onSubmit(secret)) setSecret('');
  };
  return (
    <section
      className="flex flex-col gap-4 rounded-2xl border-2 border-signal-edge bg-ink p-5"
      aria-label={typeof title === 'string' ? title : undefined}
      data-testid={testId}
    >
      <h3 className="text-[28px] font-bold">{title}</h3>
      {intro && <div className="text-[22px] leading-snug">{intro}</div>}
      {children}
      <SignatureEntry
        channel={channel}
        value={secret}
        onChange={setSecret}
        onEnter={submit}
        testId={`${testId}-secret`}
      />
      {problem && (
        <Notice tone="caution" title={t('act.notSent')}>
          {problem}
        </Notice>
      )}
      {error !== null && error !== undefined && !problem && (
        <div data-testid={`${testId}-refused`}>
          <Notice tone="warning" title={t('act.refused')}>
            {errorMessage(error)}
          </Notice>
        </div>
      )}
      <div className="flex flex-wrap gap-3">
        {onCancel && (
          <Button tone="neutral" size="large" onClick={onCancel}>
            {t('act.cancel')}
          </Button>
        )}
        <Button
          tone={tone}
          size="large"
          className="flex-1"
          disabled={isPending || secret === ''}
          onClick={submit}
        >
          {isPending ? t('act.signing') : submitLabel}
        </Button>
      </div>
    </section>
  );
}

const textArea =
  'min-h-[110px] w-full rounded-xl border-2 border-ink-line bg-ink p-4 text-[24px] leading-snug text-paper placeholder:text-ink-muted aria-[invalid=true]:border-warning-edge';
const textInput =
  'min-h-touch w-full rounded-xl border-2 border-ink-line bg-ink px-4 text-[24px] text-paper placeholder:text-ink-muted aria-[invalid=true]:border-warning-edge';

/** A labelled text box big enough for gloves; `invalid` marks the field a refusal named. */
export function TextBox({
  label,
  value,
  onChange,
  placeholder,
  multiline = false,
  invalid = false,
  hint,
  inputMode,
  type = 'text',
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
  placeholder?: string;
  multiline?: boolean;
  invalid?: boolean;
  hint?: string;
  inputMode?: 'text' | 'numeric' | 'decimal';
  type?: 'text' | 'date';
}) {
  return (
    <label className="flex flex-col gap-2">
      <span className="text-[22px] font-semibold">{label}</span>
      {multiline ? (
        <textarea
          rows={3}
          value={value}
          placeholder={placeholder}
          aria-invalid={invalid || undefined}
          onChange={(event) => onChange(event.target.value)}
          className={textArea}
        />
      ) : (
        <input
          type={type}
          value={value}
          placeholder={placeholder}
          inputMode={inputMode}
          aria-invalid={invalid || undefined}
          onChange={(event) => onChange(event.target.value)}
          className={textInput}
        />
      )}
      {hint && <span className="text-[20px] text-ink-muted">{hint}</span>}
    </label>
  );
}
