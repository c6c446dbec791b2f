import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { staffInputSchema, type StaffMember, type TemporaryPin } from '@shared/schemas/staff';
import { roleLabels } from '@shared/schemas/plain';
import { roleSchema } from '@shared/schemas/auth';
import {
  useBadgeCards,
  useCreateStaff,
  useDeactivateStaff,
  useUnlockStaff,
  useEditStaff,
  useResetPin,
  useStaff,
} from '../api/staff';
import { DeskPage, Loading, Panel, ServerError, tableClass } from '@/components/desk/desk-ui';
import { Field, Input, CheckboxSet } from '@/components/desk/desk-form';
import { recordTime } from '@/lib/when';
import { PrintSheet, QrImage } from '@/components/desk/print-sheet';
import { Notice } from '@/components/ui/notice';
import { AuthorisationsPanel } from './authorisations-panel';
import { Button } from '@/components/ui/button';

type StaffFormIn = z.input<typeof staffInputSchema>;
type StaffFormOut = z.output<typeof staffInputSchema>;

function StaffForm({
  editing,
  onDone,
  onPin,
}: {
  editing: StaffMember | null;
  onDone: () => void;
  onPin: (p: TemporaryPin) => void;
}) {
  const create = useCreateStaff();
  const edit = useEditStaff();
  const { register, handleSubmit, control, formState } = useForm<StaffFormIn, unknown, StaffFormOut>({
    resolver: zodResolver(
      editing ? staffInputSchema.omit({ deskPassword: true }) : staffInputSchema,
    ) as never,
    defaultValues: editing
      ? {
          badgeNumber: editing.badgeNumber,
          name: editing.name,
          licenceNumber: editing.licenceNumber ?? '',
          roles: editing.roles,
        }
      : { badgeNumber: '', name: '', licenceNumber: '', roles: ['mechanic'] },
  });
  const e = formState.errors;
  const error = create.error ?? edit.error;
  return (
    <Panel title={editing ? `Edit ${editing.name}` : 'Add a person'}>
      <form
        noValidate
        className="grid grid-cols-[140px_1fr_170px] gap-3"
        onSubmit={(e) =>
          void handleSubmit((v) => {
            if (editing) {
              edit.mutate(
                { id: editing.id, input: { name: v.name, licenceNumber: v.licenceNumber, roles: v.roles } },
                { onSuccess: onDone },
              );
            } else {
              const { deskPassword, ...rest } = v;
              create.mutate(deskPassword ? { ...rest, deskPassword } : rest, {
                onSuccess: (r) => {
                  onPin(r);
                  onDone();
                },
              });
            }
          })(e)
        }
      >
        <Field label="Badge number" error={e.badgeNumber?.message}>
          <Input {...register('badgeNumber')} readOnly={editing !== null} />
        </Field>
        <Field label="Name" error={e.name?.message}>
          <Input {...register('name')} />
        </Field>
        <Field label="Licence number" error={e.licenceNumber?.message}>
          <Input {...register('licenceNumber')} placeholder="e.g. B1-0042" />
        </Field>
        <Field label="Roles" error={e.roles?.message} className="col-span-2">
          <Controller
            control={control}
            name="roles"
            render={({ field }) => (
              <CheckboxSet
                options={roleSchema.options}
                value={field.value}
                onChange={field.onChange}
                label={(r) => roleLabels[r]}
              />
            )}
          />
        </Field>
        {!editing && (
          <Field label="Desk password (shift lead, engineering)" error={e.deskPassword?.message}>
            <Input
              type="password"
              autoComplete="new-password"
              {...register('deskPassword', { setValueAs: (v: string) => (v === '' ? undefined : v) })}
            />
          </Field>
        )}
        <div className="col-span-3 flex gap-2">
          <Button type="submit" tone="primary" disabled={create.isPending || edit.isPending}>
            {editing ? 'Save' : 'Add, with a temporary PIN'}
          </Button>
          {editing && (
            <Button tone="quiet" onClick={onDone}>
              Cancel
            </Button>
          )}
        </div>
      </form>
      <ServerError error={error} title="Not saved" />
    </Panel>
  );
}

export function StaffPage() {
  const staff = useStaff();
  const reset = useResetPin();
  const deactivate = useDeactivateStaff();
  const unlock = useUnlockStaff();
  const [editing, setEditing] = useState<StaffMember | null>(null);
  const [pin, setPin] = useState<TemporaryPin | null>(null);
  const [confirm, setConfirm] = useState<{ id: number; what: 'reset' | 'deactivate' } | null>(null);
  const [authorising, setAuthorising] = useState<StaffMember | null>(null);
  return (
    <DeskPage
      title="Staff and badges"
      actions={
        <Link to="/desk/badges/print" className="underline">
          Print badge cards
        </Link>
      }
    >
      <StaffForm
        key={editing?.id ?? 'new'}
        editing={editing}
        onDone={() => setEditing(null)}
        onPin={setPin}
      />
      {pin && (
        <Notice tone="caution" title={`Temporary PIN for ${pin.staff.name}: ${pin.temporaryPin}`}>
          Shown this once and stored only as a hash. Give it to {pin.staff.name.split(' ')[0]} in person; the
          kiosk asks for a new PIN at first sign-in.{' '}
          <Button tone="quiet" className="h-8" onClick={() => setPin(null)}>
            I have passed it on
          </Button>
        </Notice>
      )}
      <ServerError error={reset.error ?? deactivate.error ?? unlock.error} />
      {authorising && (
        <AuthorisationsPanel key={authorising.id} person={authorising} onClose={() => setAuthorising(null)} />
      )}
      <Panel>
        {staff.isPending ? (
          <Loading what="staff" />
        ) : staff.isError ? (
          <ServerError error={staff.error} />
        ) : (
          <table className={tableClass}>
            <thead>
              <tr>
                <th>Badge</th>
                <th>Name</th>
                <th>Licence</th>
                <th>Roles</th>
                <th>State</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {staff.data.map((s) => (
                <tr key={s.id} className={s.active ? '' : 'text-ink-muted'}>
                  <td className="font-mono">{s.badgeNumber}</td>
                  <td className="font-semibold">{s.name}</td>
                  <td>{s.licenceNumber ?? '—'}</td>
                  <td>{s.roles.map((r) => roleLabels[r]).join(', ')}</td>
                  <td>
                    {!s.active
                      ? '✕ deactivated'
                      : s.mustChangePin
                        ? '△ must set own PIN'
                        : s.lockedUntil && Date.parse(s.lockedUntil) > Date.now()
                          ? `locked until ${recordTime(s.lockedUntil)}`
                          : '● active'}
                  </td>
                  <td className="flex justify-end gap-2">
                    {s.active && (
                      <>
                        <Button className="h-8" onClick={() => setEditing(s)}>
                          Edit
                        </Button>
                        <Button className="h-8" onClick={() => setAuthorising(s)}>
                          Authorisations
                        </Button>
                        {s.lockedUntil && Date.parse(s.lockedUntil) > Date.now() && (
                          <Button className="h-8" onClick={() => unlock.mutate(s.id)}>
                            Unlock
                          </Button>
                        )}
                        {confirm?.id === s.id ? (
                          <>
                            <Button
                              className="h-8"
                              tone="stop"
                              onClick={() =>
                                confirm.what === 'reset'
                                  ? reset.mutate(s.id, {
                                      onSuccess: setPin,
                                      onSettled: () => setConfirm(null),
                                    })
                                  : deactivate.mutate(s.id, { onSettled: () => setConfirm(null) })
                              }
                            >
                              {confirm.what === 'reset' ? 'Yes, reset PIN' : 'Yes, deactivate'}
                            </Button>
                            <Button className="h-8" tone="quiet" onClick={() => setConfirm(null)}>
                              No
                            </Button>
                          </>
                        ) : (
                          <>
                            <Button className="h-8" onClick={() => setConfirm({ id: s.id, what: 'reset' })}>
                              Reset PIN
                            </Button>
                            <Button
                              className="h-8"
                              onClick={() => setConfirm({ id: s.id, what: 'deactivate' })}
                            >
                              Deactivate
                            </Button>
                          </>
                        )}
                      </>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Panel>
    </DeskPage>
  );
}

export function BadgeCardsPage() {
  return (
    <PrintSheet title="Badge cards" columns={2} what="badge cards" useItems={useBadgeCards}>
      {(c) => (
        // ISO/IEC 7810 ID-1 card size, 85.60 x 53.98 mm, so a card fits a standard badge holder.
        <div
          key={c.id}
          data-testid="badge-card"
          className="flex break-inside-avoid items-center gap-[3mm] rounded-[3mm] border-[0.4mm] border-black p-[3mm]"
          style={{ width: '85.6mm', height: '54mm' }}
        >
          <QrImage svg={c.qrSvg} label={`QR code of badge ${c.badgeNumber}`} sizeMm={34} />
          <div className="flex min-w-0 flex-col gap-[1mm] leading-tight">
            <div className="text-[7pt] uppercase tracking-[0.2em]">Gaugewalk badge</div>
            <div className="text-[13pt] font-bold">{c.name}</div>
            <div className="font-mono text-[15pt] font-bold">{c.badgeNumber}</div>
            <div className="text-[8pt]">{c.roles.map((r) => roleLabels[r]).join(' · ')}</div>
            {c.licenceNumber && <div className="text-[8pt]">Licence {c.licenceNumber}</div>}
          </div>
        </div>
      )}
    </PrintSheet>
  );
}
