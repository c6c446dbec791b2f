import { useRef, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { correctiveActionSchema, type CorrectiveActionInput } from '@shared/schemas/holds';
import { errorMessage } from '@/lib/api-client';
import { fieldError } from '@/lib/field-error';
import { BigCheckbox } from '@/components/ui/big-checkbox';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SignatureEntry, secretFor, type SigningChannel } from '@/components/ui/signature-entry';
import { useRecordCorrectiveAction } from '../api/record-corrective-action';
import { useTranslation } from 'react-i18next';

/** A corrective action is part of the release evidence, so it is signed: the PIN (kiosk) or password (desk) again. */
export function CorrectiveActionForm({ holdId, channel }: { holdId: number; channel: SigningChannel }) {
  const { t } = useTranslation('holds');
  const record = useRecordCorrectiveAction(holdId);
  const [secret, setSecretState] = useState('');
  // The resolver reads the secret at submit time; the keypad and the password field are not form fields.
  const typed = useRef('');
  const setSecret = (next: string) => {
    typed.current = next;
    setSecretState(next);
  };
  const {
    register,
    handleSubmit,
    reset,
    control,
    formState: { errors },
  } = useForm<CorrectiveActionInput>({
    resolver: (values, context, options) =>
      zodResolver(correctiveActionSchema)(
        {
          text: values.text,
          independentInspection: values.independentInspection,
          ...secretFor(channel, typed.current),
        },
        context,
        options,
      ),
    defaultValues: { text: '', independentInspection: false },
  });
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={(e) =>
        void handleSubmit((values) =>
          record.mutate(values, {
            onSuccess: () => reset({ text: '', independentInspection: false }),
            onSettled: () => setSecret(''),
          }),
        )(e)
      }
    >
      <label className="flex flex-col gap-2">
        <span className="text-[24px] font-semibold">{t('action.what')}</span>
        <textarea
          rows={4}
          placeholder={t('action.placeholder')}
          aria-invalid={errors.text ? true : undefined}
          className="min-h-[160px] w-full rounded-xl border-2 border-ink-line bg-ink p-4 text-[24px] leading-snug text-paper placeholder:text-ink-muted"
          {...register('text')}
        />
        {errors.text && (
          <span className="text-[22px] text-warning-text">{fieldError(errors.text.message)}</span>
        )}
      </label>
      <Controller
        control={control}
        name="independentInspection"
        render={({ field }) => (
          <BigCheckbox
            checked={field.value === true}
            onChange={field.onChange}
            testId="independent-inspection-needed"
          >
            <strong>{t('action.disturbed')}</strong> {t('action.disturbedText')}
          </BigCheckbox>
        )}
      />
      <SignatureEntry
        channel={channel}
        value={secret}
        onChange={setSecret}
        testId="corrective-action-secret"
        label={channel === 'kiosk' ? t('action.pin') : t('action.password')}
      />
      {(errors.pin ?? errors.password) && (
        <span className="text-[22px] text-warning-text">
          {fieldError((errors.pin ?? errors.password)?.message)}
        </span>
      )}
      {record.isError && (
        <Notice tone="caution" title={t('action.notRecorded')}>
          {errorMessage(record.error)}
        </Notice>
      )}
      <Button
        type="submit"
        tone="primary"
        size="large"
        className="self-start"
        disabled={record.isPending || secret === ''}
      >
        {record.isPending ? t('action.recording') : t('action.record')}
      </Button>
    </form>
  );
}
