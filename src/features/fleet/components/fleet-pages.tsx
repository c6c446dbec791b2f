import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Trans, useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { airframeInputSchema, type AirframeInput, type FleetAirframe } from '@shared/schemas/fleet';
import { useBases, useFleet, useReissueTag, useSaveAirframe, useTagSheet } from '../api/fleet';
import { useTypes } from '@/lib/shared-queries';
import { DeskPage, Loading, Panel, ServerError, DeskTable } from '@/components/desk/desk-ui';
import { Field, Input, Select, Options } from '@/components/desk/desk-form';
import { calendarDay } from '@/lib/when';
import { fieldError } from '@/lib/field-error';
import { PrintSheet, QrImage } from '@/components/desk/print-sheet';
import { Notice } from '@/components/ui/notice';
import { Button } from '@/components/ui/button';
import { hoursText, typedDecimal } from '@/lib/typed-number';

/** The API takes numbers as JSON numbers, so the form's text becomes one here (empty: not chosen). */
const asNumber = (value: unknown) =>
  value === '' || value === undefined || value === null ? undefined : Number(value);

function AirframeForm({ editing, onDone }: { editing: FleetAirframe | null; onDone: () => void }) {
  const { t } = useTranslation('fleet');
  const types = useTypes();
  const bases = useBases();
  const save = useSaveAirframe();
  const { register, handleSubmit, formState } = useForm<
    z.input<typeof airframeInputSchema>,
    unknown,
    AirframeInput
  >({
    resolver: zodResolver(airframeInputSchema),
    defaultValues: editing
      ? {
          fleetNumber: editing.fleetNumber,
          registration: editing.registration ?? '',
          serial: editing.serial,
          typeId: editing.type.id,
          baseId: editing.base.id,
          // Text in the screen's language ("4211,4") until typedDecimal reads it back on saving.
          hours: hoursText(editing.hours) as unknown as number,
          flights: editing.flights,
        }
      : { fleetNumber: '', registration: '', serial: '', hours: 0, flights: 0 },
  });
  const e = formState.errors;
  return (
    <Panel title={editing ? t('form.editTitle', { fleetNumber: editing.fleetNumber }) : t('form.addTitle')}>
      <form
        noValidate
        className="grid grid-cols-2 items-start gap-3 sm:grid-cols-4 xl:grid-cols-[120px_130px_minmax(130px,1fr)_130px_180px_110px_100px_auto]"
        onSubmit={(e) =>
          void handleSubmit((input) =>
            save.mutate({ id: editing?.id ?? null, input }, { onSuccess: onDone }),
          )(e)
        }
      >
        <Field label={t('form.fleetNumber')} error={fieldError(e.fleetNumber?.message)}>
          <Input {...register('fleetNumber')} placeholder={t('form.fleetNumberPlaceholder')} />
        </Field>
        <Field label={t('form.registration')} error={fieldError(e.registration?.message)}>
          <Input
            {...register('registration')}
            placeholder={t('form.registrationPlaceholder')}
            autoCapitalize="characters"
          />
        </Field>
        <Field label={t('form.serial')} error={fieldError(e.serial?.message)}>
          <Input {...register('serial')} />
        </Field>
        <Field label={t('form.type')} error={fieldError(e.typeId?.message)}>
          <Select {...register('typeId', { setValueAs: asNumber })}>
            <Options
              none={t('form.choose')}
              items={types.data}
              value={(type) => type.id}
              label={(type) => type.code}
            />
          </Select>
        </Field>
        <Field label={t('form.base')} error={fieldError(e.baseId?.message)}>
          <Select {...register('baseId', { setValueAs: asNumber })}>
            <Options none={t('form.choose')} items={bases.data} value={(b) => b.id} label={(b) => b.name} />
          </Select>
        </Field>
        <Field label={t('form.hours')} error={fieldError(e.hours?.message)}>
          <Input inputMode="decimal" {...register('hours', { setValueAs: typedDecimal })} />
        </Field>
        <Field label={t('form.flights')} error={fieldError(e.flights?.message)}>
          <Input inputMode="numeric" {...register('flights', { setValueAs: asNumber })} />
        </Field>
        <div className="mt-6 flex gap-2">
          <Button type="submit" tone="primary" disabled={save.isPending}>
            {editing ? t('form.save') : t('form.add')}
          </Button>
          {editing && (
            <Button tone="quiet" onClick={onDone}>
              {t('form.cancel')}
            </Button>
          )}
        </div>
      </form>
      <ServerError error={save.error} title={t('form.notSaved')} />
    </Panel>
  );
}

export function FleetPage() {
  const { t, i18n } = useTranslation('fleet');
  const fleet = useFleet();
  const reissue = useReissueTag();
  const [editing, setEditing] = useState<FleetAirframe | null>(null);
  const [confirming, setConfirming] = useState<number | null>(null);
  return (
    <DeskPage
      title={t('page.title')}
      actions={
        <Link to="/desk/tags/print" className="underline">
          {t('page.printTagSheet')}
        </Link>
      }
    >
      <AirframeForm key={editing?.id ?? 'new'} editing={editing} onDone={() => setEditing(null)} />
      {reissue.isSuccess && (
        <Notice tone="normal" title={t('reissued.title')}>
          <Trans
            t={t}
            i18nKey="reissued.body"
            values={{ code: reissue.data.tag.shortCode }}
            components={{ code: <span data-printed-code /> }}
          />
        </Notice>
      )}
      <ServerError error={reissue.error} title={t('reissued.notReissued')} />
      <Panel>
        {fleet.isPending ? (
          <Loading what={t('page.loadingWhat')} />
        ) : fleet.isError ? (
          <ServerError error={fleet.error} />
        ) : (
          <DeskTable>
            <thead>
              <tr>
                <th>{t('table.fleetNumber')}</th>
                <th>{t('table.registration')}</th>
                <th>{t('table.serial')}</th>
                <th>{t('table.type')}</th>
                <th>{t('table.base')}</th>
                <th className="text-right">{t('table.hours')}</th>
                <th className="text-right">{t('table.flights')}</th>
                <th>{t('table.tag')}</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {fleet.data.map((a) => (
                <tr key={a.id}>
                  <td className="font-semibold">{a.fleetNumber}</td>
                  <td>
                    {a.registration ?? <span className="text-ink-muted">{t('table.noRegistration')}</span>}
                  </td>
                  <td>{a.serial}</td>
                  <td>{a.type.code}</td>
                  <td>{a.base.name}</td>
                  <td className="text-right tabular">{hoursText(a.hours, i18n.language)}</td>
                  <td className="text-right tabular">{a.flights}</td>
                  <td>
                    {a.tag ? (
                      <span>
                        <span className="font-mono" data-printed-code>
                          {a.tag.shortCode}
                        </span>{' '}
                        <span className="text-ink-muted">
                          {t('table.tagSince', {
                            day: calendarDay(new Date(a.tag.issuedAt).toISOString().slice(0, 10)),
                          })}
                        </span>
                        {a.revokedTags > 0 && (
                          <span className="text-ink-muted">
                            {t('table.replaced', { count: a.revokedTags })}
                          </span>
                        )}
                      </span>
                    ) : (
                      t('table.noTag')
                    )}
                  </td>
                  <td className="flex justify-end gap-2">
                    <Button className="h-8" onClick={() => setEditing(a)}>
                      {t('table.edit')}
                    </Button>
                    {confirming === a.id ? (
                      <>
                        <Button
                          className="h-8"
                          tone="stop"
                          onClick={() => reissue.mutate(a.id, { onSettled: () => setConfirming(null) })}
                        >
                          {t('table.confirmReissue')}
                        </Button>
                        <Button className="h-8" tone="quiet" onClick={() => setConfirming(null)}>
                          {t('table.keep')}
                        </Button>
                      </>
                    ) : (
                      <Button className="h-8" onClick={() => setConfirming(a.id)}>
                        {t('table.reissue')}
                      </Button>
                    )}
                    <Link
                      className="inline-flex h-8 items-center underline"
                      to={`/desk/tags/print?ids=${a.id}`}
                    >
                      {t('table.print')}
                    </Link>
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

export function TagSheetPage() {
  const { t: words } = useTranslation('fleet');
  return (
    <PrintSheet title={words('sheet.title')} columns={3} what={words('sheet.what')} useItems={useTagSheet}>
      {(t) => (
        <figure
          key={t.airframeId}
          className="flex break-inside-avoid flex-col items-center gap-[1mm] rounded-[2mm] border-[0.4mm] border-black p-[3mm]"
          data-testid="tag"
        >
          <div className="text-[22pt] font-bold leading-none">{t.fleetNumber}</div>
          {t.registration && <div className="text-[14pt] font-semibold leading-none">{t.registration}</div>}
          <QrImage
            svg={t.qrSvg}
            label={words('sheet.qrLabel', { fleetNumber: t.fleetNumber, url: t.url })}
            sizeMm={42}
          />
          <figcaption className="text-center leading-tight">
            <div className="font-mono text-[16pt] font-bold tracking-[0.15em]" data-printed-code>
              {t.shortCode}
            </div>
            <div className="text-[8pt]">{words('sheet.hint', { typeCode: t.typeCode })}</div>
          </figcaption>
        </figure>
      )}
    </PrintSheet>
  );
}
