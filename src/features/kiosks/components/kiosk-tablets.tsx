import { useState } from 'react';
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
import { QrCode } from '@/components/ui/qr-code';
import { recordTime } from '@/lib/when';
import { inputClass } from '@/components/desk/desk-form';

const stateWords: Record<KioskTablet['state'], string> = {
  enrolled: 'Enrolled',
  awaiting_enrolment: 'Waiting for enrolment',
  link_expired: 'Link expired, never enrolled',
  revoked: 'Revoked',
};
const stateTone: Record<KioskTablet['state'], string> = {
  enrolled: 'bg-normal-bright text-on-fill',
  awaiting_enrolment: 'bg-caution-bright text-on-fill',
  link_expired: 'bg-ink-raised text-paper border-2 border-ink-line',
  revoked: 'bg-ink-raised text-paper border-2 border-ink-line line-through',
};

/** Tablets that work or can still be enrolled come first; dead links and revoked tablets follow, newest first. */
const live = (k: KioskTablet) => k.state === 'enrolled' || k.state === 'awaiting_enrolment';
const inUseFirst = (kiosks: KioskTablet[]) => [...kiosks.filter(live), ...kiosks.filter((k) => !live(k))];

/** The tablet's name says where it hangs; renamed when it moves, so the list and the records keep making sense. */
function RenameTablet({ kiosk, onDone }: { kiosk: KioskTablet; onDone: () => void }) {
  const rename = useRenameKiosk();
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
        <span className="text-[17px] font-semibold">New name for "{kiosk.name}"</span>
        <input {...register('name')} className={inputClass} />
      </label>
      <Button type="submit" tone="primary" disabled={rename.isPending}>
        Save name
      </Button>
      <Button tone="neutral" onClick={onDone}>
        Cancel
      </Button>
      {formState.errors.name && (
        <p className="w-full text-[17px] text-warning-text">{formState.errors.name.message}</p>
      )}
      {rename.isError && (
        <div className="w-full">
          <Notice tone="caution" title="Not renamed">
            {errorMessage(rename.error)}
          </Notice>
        </div>
      )}
    </form>
  );
}

export function KioskTablets() {
  const kiosks = useKiosks();
  const create = useCreateKiosk();
  const revoke = useRevokeKiosk();
  const [renaming, setRenaming] = useState<number | null>(null);
  const [name, setName] = useState('');
  const [enrolment, setEnrolment] = useState<KioskEnrolment | null>(null);
  const enrolUrl = enrolment ? new URL(enrolment.enrolPath, window.location.origin).toString() : null;

  return (
    <div className="flex flex-col gap-6">
      <section className="flex flex-col gap-4 rounded-xl border-2 border-ink-line bg-ink-soft p-4">
        <h2 className="text-[17px] font-bold">Enrol a tablet</h2>
        <form
          className="flex flex-wrap gap-4"
          onSubmit={(event) => {
            event.preventDefault();
            create.mutate(name, {
              onSuccess: (result) => {
                setEnrolment(result);
                setName('');
              },
            });
          }}
        >
          <label className="flex min-w-[320px] flex-1 flex-col gap-2">
            <span className="text-[17px] font-semibold">Tablet name (where it hangs)</span>
            <input
              value={name}
              onChange={(event) => setName(event.target.value)}
              placeholder="North Pad wall, bay 2"
              className={inputClass}
            />
          </label>
          <Button
            type="submit"
            tone="primary"

            className="self-end"
            disabled={create.isPending || name.trim() === ''}
          >
            Create enrolment link
          </Button>
        </form>
        {create.isError && (
          <Notice tone="caution" title="No link made">
            {errorMessage(create.error)}
          </Notice>
        )}
        {enrolment && enrolUrl && (
          <div className="flex flex-wrap items-center gap-6" data-testid="enrolment-link">
            <QrCode url={enrolUrl} alt={`QR code for ${enrolUrl}`} />
            <div className="flex min-w-0 flex-1 flex-col gap-2">
              <div className="text-[18px] font-semibold">
                Open this on the tablet "{enrolment.name}", or scan the code with its camera:
              </div>
              <code className="break-all rounded-lg bg-ink p-3 text-[17px]">{enrolUrl}</code>
              <div className="text-[17px] text-ink-muted">
                One use only; expires {recordTime(enrolment.expiresAt, 'never')}.
              </div>
            </div>
          </div>
        )}
      </section>

      <section className="flex flex-col gap-3">
        <h2 className="text-[17px] font-bold">Kiosk tablets</h2>
        {kiosks.isPending && <p className="text-ink-muted">Loading…</p>}
        {kiosks.isError && (
          <Notice tone="warning" title="The list did not load">
            {errorMessage(kiosks.error)}
          </Notice>
        )}
        {revoke.isError && (
          <Notice tone="caution" title="Not revoked">
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
                ) : (
                  <>
                    <div className="min-w-[260px] flex-1">
                      <div className="text-[19px] font-semibold">{kiosk.name}</div>
                      <div className="text-[16px] text-ink-muted">
                        {kiosk.enrolledAt
                          ? `Enrolled ${recordTime(kiosk.enrolledAt, 'never')} · last seen ${recordTime(kiosk.lastSeenAt, 'never')}`
                          : `Enrolment link ${kiosk.state === 'link_expired' ? 'ran out' : 'valid until'} ${recordTime(kiosk.enrolExpiresAt, 'never')}`}
                        {kiosk.revokedAt ? ` · revoked ${recordTime(kiosk.revokedAt, 'never')}` : ''}
                      </div>
                    </div>
                    <span
                      className={`rounded-lg px-3 py-1.5 text-[17px] font-bold ${stateTone[kiosk.state]}`}
                    >
                      {stateWords[kiosk.state]}
                    </span>
                    {live(kiosk) && (
                      <>
                        <Button tone="neutral" onClick={() => setRenaming(kiosk.id)}>
                          Rename
                        </Button>
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
