import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { correctiveActionSchema, type CorrectiveActionInput } from '../../../../shared/schemas/holds';
import { errorMessage } from '../../../lib/api-client';
import { BigCheckbox } from '../../../components/ui/big-checkbox';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useRecordCorrectiveAction } from '../api/record-corrective-action';

export function CorrectiveActionForm({ holdId }: { holdId: number }) {
  const record = useRecordCorrectiveAction(holdId);
  const {
    register,
    handleSubmit,
    reset,
    control,
    formState: { errors },
  } = useForm<CorrectiveActionInput>({
    resolver: zodResolver(correctiveActionSchema),
    defaultValues: { text: '', independentInspection: false },
  });
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={handleSubmit((values) =>
        record.mutate(values, { onSuccess: () => reset({ text: '', independentInspection: false }) }),
      )}
    >
      <label className="flex flex-col gap-2">
        <span className="text-[24px] font-semibold">What was done to correct it</span>
        <textarea
          rows={4}
          placeholder="e.g. Replaced the leaking union at the system 2 pump, refilled to NORMAL with MIL-PRF-83282 batch 4471."
          aria-invalid={errors.text ? true : undefined}
          className="min-h-[160px] w-full rounded-xl border-2 border-ink-line bg-ink p-4 text-[24px] leading-snug text-paper placeholder:text-ink-muted"
          {...register('text')}
        />
        {errors.text && <span className="text-[22px] text-warning-text">{errors.text.message}</span>}
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
            <strong>Flight controls or another system was disturbed:</strong> a second person must inspect
            before the release.
          </BigCheckbox>
        )}
      />
      {record.isError && (
        <Notice tone="caution" title="Not recorded">
          {errorMessage(record.error)}
        </Notice>
      )}
      <Button type="submit" tone="primary" size="large" className="self-start" disabled={record.isPending}>
        {record.isPending ? 'Recording…' : 'Record corrective action'}
      </Button>
    </form>
  );
}
