import { useForm } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import { zodResolver } from '@hookform/resolvers/zod';
import { deskSignInSchema, type DeskSignIn, type SessionInfo } from '@shared/schemas/auth';
import { errorMessage } from '@/lib/api-client';
import { fieldError } from '@/lib/field-error';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useDeskSignIn } from '../api/desk-sign-in';

// The form's field names, as the schema names them.
const fields = { badge: 'badge', password: 'password' } as const satisfies Record<keyof DeskSignIn, string>;

const field =
  'min-h-touch w-full rounded-xl border-2 border-ink-line bg-ink px-5 text-[28px] text-paper placeholder:text-ink-muted';

export function DeskSignInForm({ onSignedIn }: { onSignedIn: (session: SessionInfo) => void }) {
  const signIn = useDeskSignIn();
  const { t } = useTranslation('auth');
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<DeskSignIn>({
    resolver: zodResolver(deskSignInSchema),
    defaultValues: { badge: '', password: '' },
  });

  return (
    <form
      className="flex w-full max-w-[560px] flex-col gap-5"
      noValidate
      onSubmit={(e) => void handleSubmit((values) => signIn.mutate(values, { onSuccess: onSignedIn }))(e)}
    >
      <label className="flex flex-col gap-2">
        <span className="text-lead font-semibold">{t('badgeNumber')}</span>
        <input
          className={field}
          inputMode="numeric"
          autoComplete="username"
          aria-invalid={errors.badge ? true : undefined}
          {...register(fields.badge)}
        />
        {errors.badge && (
          <span className="text-[22px] text-warning-text">{fieldError(errors.badge.message)}</span>
        )}
      </label>
      <label className="flex flex-col gap-2">
        <span className="text-lead font-semibold">{t('desk.password')}</span>
        <input
          className={field}
          type="password"
          autoComplete="current-password"
          aria-invalid={errors.password ? true : undefined}
          {...register(fields.password)}
        />
        {errors.password && (
          <span className="text-[22px] text-warning-text">{fieldError(errors.password.message)}</span>
        )}
      </label>
      {signIn.isError && (
        <Notice tone="caution" title={t('notSignedIn')}>
          {errorMessage(signIn.error)}
        </Notice>
      )}
      <Button type="submit" tone="primary" size="large" disabled={signIn.isPending}>
        {signIn.isPending ? t('signingIn') : t('desk.signIn')}
      </Button>
    </form>
  );
}
