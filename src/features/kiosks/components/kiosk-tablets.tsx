import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { kioskRenameSchema } from '@shared/schemas/kiosks';
import { errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { ConfirmRevoke } from '@/components/ui/confirm-revoke';
import { Notice } from '@/components/ui/notice';
import { useKiosks, type KioskTablet } from '../api/get-kiosks';
import { useCreateKiosk, type KioskEnrolment } from '../api/create-kiosk';
import { useRevokeKiosk } from '../api/revoke-kiosk';
import { useRenameKiosk } from '../api/rename-kiosk';
import { usePlaceKiosk } from '../api/place-kiosk';
import { QrCode } from '@/components/ui/qr-code';
import { recordTime } from '@/lib/when';
import { fieldError } from '@/lib/field-error';
import { inputClass, Options, Select } from '@/components/desk/desk-form';
import { baseWords, type BaseOption } from '@/lib/base-words';

// Each state's words are catalogue keys (namespace kiosks), read at render.
const stateWords = {
  enrolled: 'states.enrolled',
  awaiting_enrolment: 'states.awaitingEnrolment',
  link_expired: 'states.linkExpired',
  revoked: 'states.revoked',
} as const satisfies Record<KioskTablet['state'], string>;
const stateTone: Record<KioskTablet['state'], string> = {
  enrolled: 'bg-normal-bright text-on-fill',
  awaiting_enrolment: 'bg-caution-bright text-on-fill',
  link_expired: 'bg-ink-raised text-paper border-2 border-ink-line',
  revoked: 'bg-ink-raised text-paper border-2 border-ink-line line-through',
};

// The rename form's one field, as the schema names it.
const nameField = 'name' as const;

/** Tablets that work or can still be enrolled come first; dead links and revoked tablets follow, newest first. */
const live = (k: KioskTablet) => k.state === 'enrolled' || k.state === 'awaiting_enrolment';
const inUseFirst = (kiosks: KioskTablet[]) => [...kiosks.filter(live), ...kiosks.filter((k) => !live(k))];

/** The end of a tablet's inline form: save, cancel, and why it was not saved. */
function FormEnd({
  saveLabel,
  failedTitle,
  pending,
  error,
  onCancel,
}: {
  saveLabel: string;
  failedTitle: string;
  pending: boolean;
  error: Error | null;
  onCancel: () => void;
}) {
  const { t } = useTranslation('kiosks');
  return (
    <>
      <Button type="submit" tone="primary" disabled={pending}>
        {saveLabel}
      </Button>
      <Button tone="neutral" onClick={onCancel}>
        {t('cancel')}
      </Button>
      {error && (
        <div className="w-full">
          <Notice tone="caution" title={failedTitle}>
            {errorMessage(error)}
          </Notice>
        </div>
      )}
    </>
  );
}

/** The tablet's name says where it hangs; renamed when it moves, so the list and the records keep making sense. */
function RenameTablet({ kiosk, onDone }: { kiosk: KioskTablet; onDone: () => void }) {
  const rename = useRenameKiosk();
  const { t } = useTranslation('kiosks');
  const { register, handleSubmit, formState } = useForm<{ name: string }>({
    resolver: zodResolver(kioskRenameSchema),
    defaultValues: { name: kiosk.name },
  });
  return (
    <form
      noValidate
      className="flex min-w-[260px] flex-1 flex-wrap items-end gap-3"
      onSubmit={(e) =>
        void handleSubmit((values) =>
          rename.mutate({ id: kiosk.id, name: values.name }, { onSuccess: onDone }),
        )(e)
      }
    >
      <label className="flex min-w-[260px] flex-1 flex-col gap-2">
        <span className="text-[17px] font-semibold">{t('rename.label', { name: kiosk.name })}</span>
        <input {...register(nameField)} className={inputClass} />
      </label>
      <FormEnd
        saveLabel={t('rename.save')}
        failedTitle={t('rename.failed')}
        pending={rename.isPending}
        error={rename.error}
        onCancel={onDone}
      />
      {formState.errors.name && (
        <p className="w-full text-[17px] text-warning-text">{fieldError(formState.errors.name.message)}</p>
      )}
    </form>
  );
}

/** Where the tablet stands: its airframe list shows that base's airframes first. On the audit trail like a rename. */
function PlaceTablet({
  kiosk,
  bases,
  onDone,
}: {
  kiosk: KioskTablet;
  bases: readonly BaseOption[];
  onDone: () => void;
}) {
  const place = usePlaceKiosk();
  const { t } = useTranslation('kiosks');
  const [base, setBase] = useState(kiosk.base?.code ?? '');
  return (
    <form
      className="flex min-w-[260px] flex-1 flex-wrap items-end gap-3"
      onSubmit={(event) => {
        event.preventDefault();
        place.mutate({ id: kiosk.id, base: base || null }, { onSuccess: onDone });
      }}
    >
      <label className="flex min-w-[260px] flex-1 flex-col gap-2">
        <span className="text-[17px] font-semibold">{t('place.label', { name: kiosk.name })}</span>
        <Select value={base} onChange={(event) => setBase(event.target.value)}>
          <Options none={t('place.noBase')} items={bases} value={(b) => b.code} label={baseWords} />
        </Select>
      </label>
      <FormEnd
        saveLabel={t('place.save')}
        failedTitle={t('place.failed')}
        pending={place.isPending}
        error={place.error}
        onCancel={onDone}
      />
    </form>
  );
}

export function KioskTablets({ bases }: { bases: readonly BaseOption[] }) {
  const kiosks = useKiosks();
  const create = useCreateKiosk();
  const revoke = useRevokeKiosk();
  const { t } = useTranslation('kiosks');
  const [renaming, setRenaming] = useState<number | null>(null);
  const [placing, setPlacing] = useState<number | null>(null);
  const [name, setName] = useState('');
  const [base, setBase] = useState('');
  const [enrolment, setEnrolment] = useState<KioskEnrolment | null>(null);
  const enrolUrl = enrolment ? new URL(enrolment.enrolPath, window.location.origin).toString() : null;

  return (
    <div className="flex flex-col gap-6">
      <section className="flex flex-col gap-4 rounded-xl border-2 border-ink-line bg-ink-soft p-4">
        <h2 className="text-[17px] font-bold">{t('enrol.title')}</h2>
        <form
          className="flex flex-wrap gap-4"
          onSubmit={(event) => {
            event.preventDefault();
            create.mutate(
              { name, base: base || null },
              {
                onSuccess: (result) => {
                  setEnrolment(result);
                  setName('');
                },
              },
            );
          }}
        >
          <label className="flex min-w-[320px] flex-1 flex-col gap-2">
            <span className="text-[17px] font-semibold">{t('enrol.nameLabel')}</span>
            <input
              value={name}
              onChange={(event) => setName(event.target.value)}
              placeholder={t('enrol.namePlaceholder')}
              className={inputClass}
            />
          </label>
          {bases.length > 0 && (
            <label className="flex min-w-[280px] flex-col gap-2">
              <span className="text-[17px] font-semibold">{t('enrol.baseLabel')}</span>
              <Select name="tablet-base" value={base} onChange={(event) => setBase(event.target.value)}>
                <Options none={t('enrol.noBase')} items={bases} value={(b) => b.code} label={baseWords} />
              </Select>
            </label>
          )}
          <Button
            type="submit"
            tone="primary"
            className="self-end"
            disabled={create.isPending || name.trim() === ''}
          >
            {t('enrol.create')}
          </Button>
        </form>
        {create.isError && (
          <Notice tone="caution" title={t('enrol.failed')}>
            {errorMessage(create.error)}
          </Notice>
        )}
        {enrolment && enrolUrl && (
          <div className="flex flex-wrap items-center gap-6" data-testid="enrolment-link">
            <QrCode url={enrolUrl} alt={t('enrol.qrAlt', { url: enrolUrl })} />
            <div className="flex min-w-0 flex-1 flex-col gap-2">
              <div className="text-[18px] font-semibold">
                {t('enrol.openOnTablet', { name: enrolment.name })}
              </div>
              <code className="break-all rounded-lg bg-ink p-3 text-[17px]">{enrolUrl}</code>
              <div className="text-[17px] text-ink-muted">
                {t('enrol.oneUse', { expires: recordTime(enrolment.expiresAt, t('never')) })}
              </div>
            </div>
          </div>
        )}
      </section>

      <section className="flex flex-col gap-3">
        <h2 className="text-[17px] font-bold">{t('list.title')}</h2>
        {kiosks.isPending && <p className="text-ink-muted">{t('list.loading')}</p>}
        {kiosks.isError && (
          <Notice tone="warning" title={t('list.notLoaded')}>
            {errorMessage(kiosks.error)}
          </Notice>
        )}
        {revoke.isError && (
          <Notice tone="caution" title={t('list.notRevoked')}>
            {errorMessage(revoke.error)}
          </Notice>
        )}
        <ul className="flex flex-col gap-3">
          {kiosks.data &&
            inUseFirst(kiosks.data).map((kiosk) => (
              <li
                key={kiosk.id}
                data-testid={`kiosk-${kiosk.id}`}
                className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-ink-line bg-ink-soft p-4"
              >
                {renaming === kiosk.id ? (
                  <RenameTablet kiosk={kiosk} onDone={() => setRenaming(null)} />
                ) : placing === kiosk.id ? (
                  <PlaceTablet kiosk={kiosk} bases={bases} onDone={() => setPlacing(null)} />
                ) : (
                  <>
                    <div className="min-w-[260px] flex-1">
                      <div className="text-[19px] font-semibold">{kiosk.name}</div>
                      <div className="text-[16px] text-ink-muted">
                        {kiosk.enrolledAt
                          ? t('list.enrolledLine', {
                              enrolled: recordTime(kiosk.enrolledAt, t('never')),
                              lastSeen: recordTime(kiosk.lastSeenAt, t('never')),
                            })
                          : t(kiosk.state === 'link_expired' ? 'list.linkRanOut' : 'list.linkValidUntil', {
                              at: recordTime(kiosk.enrolExpiresAt, t('never')),
                            })}
                        {kiosk.revokedAt
                          ? t('list.revokedSuffix', { at: recordTime(kiosk.revokedAt, t('never')) })
                          : ''}
                      </div>
                      {live(kiosk) && (
                        <div className="text-[16px] text-ink-muted" data-testid="kiosk-base">
                          {kiosk.base ? t('list.atBase', { base: baseWords(kiosk.base) }) : t('list.noBase')}
                        </div>
                      )}
                    </div>
                    <span
                      className={`rounded-lg px-3 py-1.5 text-[17px] font-bold ${stateTone[kiosk.state]}`}
                    >
                      {t(stateWords[kiosk.state])}
                    </span>
                    {live(kiosk) && (
                      <>
                        <Button tone="neutral" onClick={() => setRenaming(kiosk.id)}>
                          {t('list.rename')}
                        </Button>
                        {bases.length > 0 && (
                          <Button tone="neutral" onClick={() => setPlacing(kiosk.id)}>
                            {t('place.button')}
                          </Button>
                        )}
                        <ConfirmRevoke
                          name={kiosk.name}
                          pending={revoke.isPending}
                          onRevoke={(settled) => revoke.mutate(kiosk.id, { onSettled: settled })}
                        />
                      </>
                    )}
                  </>
                )}
              </li>
            ))}
        </ul>
      </section>
    </div>
  );
}
