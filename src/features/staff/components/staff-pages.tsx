import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { staffInputSchema, type StaffMember, type TemporaryPin } from '@shared/schemas/staff';
import { roleSchema } from '@shared/schemas/auth';
import { languageNames, languages } from '@shared/i18n/languages';
import {
  useBadgeCards,
  useCreateStaff,
  useDeactivateStaff,
  useUnlockStaff,
  useEditStaff,
  useResetPin,
  useStaff,
} from '../api/staff';
import { DeskPage, Loading, Panel, ServerError, DeskTable } from '@/components/desk/desk-ui';
import { Field, Input, CheckboxSet, Options, Select } from '@/components/desk/desk-form';
import { recordTime } from '@/lib/when';
import { fieldError } from '@/lib/field-error';
import { PrintSheet, QrImage } from '@/components/desk/print-sheet';
import { Notice } from '@/components/ui/notice';
import { AuthorisationsPanel } from './authorisations-panel';
import { Button } from '@/components/ui/button';
import { roleLabel } from '@shared/schemas/plain';

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
  const { t } = useTranslation('staff');
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
          preferredLanguage: editing.preferredLanguage,
        }
      : { badgeNumber: '', name: '', licenceNumber: '', roles: ['mechanic'], preferredLanguage: null },
  });
  const e = formState.errors;
  const error = create.error ?? edit.error;
  return (
    <Panel title={editing ? t('form.editTitle', { name: editing.name }) : t('form.addTitle')}>
      <form
        noValidate
        className="grid grid-cols-[200px_1fr_220px] gap-3"
        onSubmit={(e) =>
          void handleSubmit((v) => {
            if (editing) {
              edit.mutate(
                {
                  id: editing.id,
                  input: {
                    name: v.name,
                    licenceNumber: v.licenceNumber,
                    roles: v.roles,
                    preferredLanguage: v.preferredLanguage,
                  },
                },
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
        <Field label={t('form.badgeNumber')} error={fieldError(e.badgeNumber?.message)}>
          <Input {...register('badgeNumber')} readOnly={editing !== null} />
        </Field>
        <Field label={t('form.name')} error={fieldError(e.name?.message)}>
          <Input {...register('name')} />
        </Field>
        <Field label={t('form.licenceNumber')} error={fieldError(e.licenceNumber?.message)}>
          <Input {...register('licenceNumber')} placeholder={t('form.licencePlaceholder')} />
        </Field>
        <Field label={t('form.roles')} error={fieldError(e.roles?.message)} className="col-span-2">
          <Controller
            control={control}
            name="roles"
            render={({ field }) => (
              <CheckboxSet
                options={roleSchema.options}
                value={field.value}
                onChange={field.onChange}
                label={(role) => roleLabel(role)}
              />
            )}
          />
        </Field>
        <Field
          label={t('form.preferredLanguage')}
          error={fieldError(e.preferredLanguage?.message)}
          hint={t('form.preferredLanguageHint')}
        >
          <Select {...register('preferredLanguage', { setValueAs: (v: string) => (v === '' ? null : v) })}>
            <Options
              none={t('form.tabletLanguage')}
              items={languages}
              value={(l) => l}
              label={(l) => <span lang={l}>{languageNames[l]}</span>}
            />
          </Select>
        </Field>
        {!editing && (
          <Field label={t('form.deskPassword')} error={fieldError(e.deskPassword?.message)}>
            <Input
              type="password"
              autoComplete="new-password"
              {...register('deskPassword', { setValueAs: (v: string) => (v === '' ? undefined : v) })}
            />
          </Field>
        )}
        <div className="col-span-3 flex gap-2">
          <Button type="submit" tone="primary" disabled={create.isPending || edit.isPending}>
            {editing ? t('form.save') : t('form.add')}
          </Button>
          {editing && (
            <Button tone="quiet" onClick={onDone}>
              {t('form.cancel')}
            </Button>
          )}
        </div>
      </form>
      <ServerError error={error} title={t('form.notSaved')} />
    </Panel>
  );
}

export function StaffPage() {
  const { t } = useTranslation('staff');
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
      title={t('page.title')}
      actions={
        <Link to="/desk/badges/print" className="underline">
          {t('page.printBadgeCards')}
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
        <Notice tone="caution" title={t('pin.title', { name: pin.staff.name, pin: pin.temporaryPin })}>
          {t('pin.body', { firstName: pin.staff.name.split(' ')[0] })}{' '}
          <Button tone="quiet" className="h-8" onClick={() => setPin(null)}>
            {t('pin.passedOn')}
          </Button>
        </Notice>
      )}
      <ServerError error={reset.error ?? deactivate.error ?? unlock.error} />
      {authorising && (
        <AuthorisationsPanel key={authorising.id} person={authorising} onClose={() => setAuthorising(null)} />
      )}
      <Panel>
        {staff.isPending ? (
          <Loading what={t('page.loadingWhat')} />
        ) : staff.isError ? (
          <ServerError error={staff.error} />
        ) : (
          <DeskTable>
            <thead>
              <tr>
                <th>{t('table.badge')}</th>
                <th>{t('table.name')}</th>
                <th>{t('table.licence')}</th>
                <th>{t('table.roles')}</th>
                <th>{t('table.language')}</th>
                <th>{t('table.state')}</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {staff.data.map((s) => (
                <tr key={s.id} className={s.active ? '' : 'text-ink-muted'}>
                  <td className="font-mono">{s.badgeNumber}</td>
                  <td className="font-semibold">{s.name}</td>
                  <td>{s.licenceNumber ?? '—'}</td>
                  <td>{s.roles.map((role) => roleLabel(role)).join(', ')}</td>
                  <td lang={s.preferredLanguage ?? undefined}>
                    {s.preferredLanguage ? languageNames[s.preferredLanguage] : t('table.tabletLanguage')}
                  </td>
                  <td>
                    {!s.active
                      ? t('state.deactivated')
                      : s.mustChangePin
                        ? t('state.mustSetPin')
                        : s.lockedUntil && Date.parse(s.lockedUntil) > Date.now()
                          ? t('state.lockedUntil', { time: recordTime(s.lockedUntil) })
                          : t('state.active')}
                  </td>
                  <td className="flex justify-end gap-2">
                    {s.active && (
                      <>
                        <Button className="h-8" onClick={() => setEditing(s)}>
                          {t('actions.edit')}
                        </Button>
                        <Button className="h-8" onClick={() => setAuthorising(s)}>
                          {t('actions.authorisations')}
                        </Button>
                        {s.lockedUntil && Date.parse(s.lockedUntil) > Date.now() && (
                          <Button className="h-8" onClick={() => unlock.mutate(s.id)}>
                            {t('actions.unlock')}
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
                              {confirm.what === 'reset'
                                ? t('actions.confirmReset')
                                : t('actions.confirmDeactivate')}
                            </Button>
                            <Button className="h-8" tone="quiet" onClick={() => setConfirm(null)}>
                              {t('actions.no')}
                            </Button>
                          </>
                        ) : (
                          <>
                            <Button className="h-8" onClick={() => setConfirm({ id: s.id, what: 'reset' })}>
                              {t('actions.resetPin')}
                            </Button>
                            <Button
                              className="h-8"
                              onClick={() => setConfirm({ id: s.id, what: 'deactivate' })}
                            >
                              {t('actions.deactivate')}
                            </Button>
                          </>
                        )}
                      </>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </DeskTable>
        )}
      </Panel>
    </DeskPage>
  );
}

export function BadgeCardsPage() {
  const { t } = useTranslation('staff');
  return (
    <PrintSheet title={t('cards.title')} columns={2} what={t('cards.what')} useItems={useBadgeCards}>
      {(c) => (
        // ISO/IEC 7810 ID-1 card size, 85.60 x 53.98 mm, so a card fits a standard badge holder.
        <div
          key={c.id}
          data-testid="badge-card"
          className="flex break-inside-avoid items-center gap-[3mm] rounded-[3mm] border-[0.4mm] border-black p-[3mm]"
          style={{ width: '85.6mm', height: '54mm' }}
        >
          <QrImage svg={c.qrSvg} label={t('cards.qrLabel', { badge: c.badgeNumber })} sizeMm={34} />
          <div className="flex min-w-0 flex-col gap-[1mm] leading-tight">
            <div className="text-[7pt] uppercase tracking-[0.2em]">{t('cards.heading')}</div>
            <div className="text-[13pt] font-bold">{c.name}</div>
            <div className="font-mono text-[15pt] font-bold">{c.badgeNumber}</div>
            <div className="text-[8pt]">{c.roles.map((role) => roleLabel(role)).join(' · ')}</div>
            {c.licenceNumber && (
              <div className="text-[8pt]">{t('cards.licence', { licence: c.licenceNumber })}</div>
            )}
          </div>
        </div>
      )}
    </PrintSheet>
  );
}
