import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { airframeInputSchema, type AirframeInput, type FleetAirframe } from '@shared/schemas/fleet';
import { useBases, useFleet, useReissueTag, useSaveAirframe, useTagSheet } from '../api/fleet';
import { useTypes } from '@/lib/shared-queries';
import { DeskPage, Loading, Panel, ServerError, tableClass } from '@/components/desk/desk-ui';
import { Field, Input, Select, Options } from '@/components/desk/desk-form';
import { recordTime } from '@/lib/when';
import { PrintSheet, QrImage } from '@/components/desk/print-sheet';
import { Notice } from '@/components/ui/notice';
import { Button } from '@/components/ui/button';

/** The API takes numbers as JSON numbers, so the form's text becomes one here (empty: not chosen). */
const asNumber = (value: unknown) =>
  value === '' || value === undefined || value === null ? undefined : Number(value);

function AirframeForm({ editing, onDone }: { editing: FleetAirframe | null; onDone: () => void }) {
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
          hours: editing.hours,
          flights: editing.flights,
        }
      : { fleetNumber: '', registration: '', serial: '', hours: 0, flights: 0 },
  });
  const e = formState.errors;
  return (
    <Panel title={editing ? `Edit ${editing.fleetNumber}` : 'Add an airframe'}>
      <form
        noValidate
        className="grid grid-cols-[120px_130px_1fr_150px_200px_110px_100px_auto] items-start gap-3"
        onSubmit={(e) =>
          void handleSubmit((input) =>
            save.mutate({ id: editing?.id ?? null, input }, { onSuccess: onDone }),
          )(e)
        }
      >
        <Field label="Fleet number" error={e.fleetNumber?.message}>
          <Input {...register('fleetNumber')} placeholder="T-09" />
        </Field>
        <Field label="Registration" error={e.registration?.message}>
          <Input {...register('registration')} placeholder="QX-TNJ" autoCapitalize="characters" />
        </Field>
        <Field label="Serial" error={e.serial?.message}>
          <Input {...register('serial')} />
        </Field>
        <Field label="Type" error={e.typeId?.message}>
          <Select {...register('typeId', { setValueAs: asNumber })}>
            <Options none="choose…" items={types.data} value={(t) => t.id} label={(t) => t.code} />
          </Select>
        </Field>
        <Field label="Base" error={e.baseId?.message}>
          <Select {...register('baseId', { setValueAs: asNumber })}>
            <Options none="choose…" items={bases.data} value={(b) => b.id} label={(b) => b.name} />
          </Select>
        </Field>
        <Field label="Hours" error={e.hours?.message}>
          <Input inputMode="decimal" {...register('hours', { setValueAs: asNumber })} />
        </Field>
        <Field label="Flights" error={e.flights?.message}>
          <Input inputMode="numeric" {...register('flights', { setValueAs: asNumber })} />
        </Field>
        <div className="mt-6 flex gap-2">
          <Button type="submit" tone="primary" disabled={save.isPending}>
            {editing ? 'Save' : 'Add, with a tag'}
          </Button>
          {editing && (
            <Button tone="quiet" onClick={onDone}>
              Cancel
            </Button>
          )}
        </div>
      </form>
      <ServerError error={save.error} title="Airframe not saved" />
    </Panel>
  );
}

export function FleetPage() {
  const fleet = useFleet();
  const reissue = useReissueTag();
  const [editing, setEditing] = useState<FleetAirframe | null>(null);
  const [confirming, setConfirming] = useState<number | null>(null);
  return (
    <DeskPage
      title="Airframes and tags"
      actions={
        <Link to="/desk/tags/print" className="underline">
          Print the tag sheet
        </Link>
      }
    >
      <AirframeForm key={editing?.id ?? 'new'} editing={editing} onDone={() => setEditing(null)} />
      {reissue.isSuccess && (
        <Notice tone="normal" title="Tag reissued">
          The old tag stopped working. New code <span data-printed-code>{reissue.data.tag.shortCode}</span>:
          print it and replace the tag on the airframe.
        </Notice>
      )}
      <ServerError error={reissue.error} title="Tag not reissued" />
      <Panel>
        {fleet.isPending ? (
          <Loading what="fleet" />
        ) : fleet.isError ? (
          <ServerError error={fleet.error} />
        ) : (
          <table className={tableClass}>
            <thead>
              <tr>
                <th>Fleet no.</th>
                <th>Registration</th>
                <th>Serial</th>
                <th>Type</th>
                <th>Base</th>
                <th className="text-right">Hours</th>
                <th className="text-right">Flights</th>
                <th>Tag</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {fleet.data.map((a) => (
                <tr key={a.id}>
                  <td className="font-semibold">{a.fleetNumber}</td>
                  <td>{a.registration ?? <span className="text-ink-muted">none</span>}</td>
                  <td>{a.serial}</td>
                  <td>{a.type.code}</td>
                  <td>{a.base.name}</td>
                  <td className="text-right tabular">{a.hours.toFixed(1)}</td>
                  <td className="text-right tabular">{a.flights}</td>
                  <td>
                    {a.tag ? (
                      <span>
                        <span className="font-mono" data-printed-code>
                          {a.tag.shortCode}
                        </span>{' '}
                        <span className="text-ink-muted">
                          since {recordTime(a.tag.issuedAt).slice(0, 10)}
                        </span>
                        {a.revokedTags > 0 && (
                          <span className="text-ink-muted"> · {a.revokedTags} replaced</span>
                        )}
                      </span>
                    ) : (
                      'no tag'
                    )}
                  </td>
                  <td className="flex justify-end gap-2">
                    <Button className="h-8" onClick={() => setEditing(a)}>
                      Edit
                    </Button>
                    {confirming === a.id ? (
                      <>
                        <Button
                          className="h-8"
                          tone="stop"
                          onClick={() => reissue.mutate(a.id, { onSettled: () => setConfirming(null) })}
                        >
                          Revoke old, issue new
                        </Button>
                        <Button className="h-8" tone="quiet" onClick={() => setConfirming(null)}>
                          Keep
                        </Button>
                      </>
                    ) : (
                      <Button className="h-8" onClick={() => setConfirming(a.id)}>
                        Reissue tag
                      </Button>
                    )}
                    <Link
                      className="inline-flex h-8 items-center underline"
                      to={`/desk/tags/print?ids=${a.id}`}
                    >
                      Print
                    </Link>
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

export function TagSheetPage() {
  return (
    <PrintSheet title="Tag sheet" columns={3} what="tags" useItems={useTagSheet}>
      {(t) => (
        <figure
          key={t.airframeId}
          className="flex break-inside-avoid flex-col items-center gap-[1mm] rounded-[2mm] border-[0.4mm] border-black p-[3mm]"
          data-testid="tag"
        >
          <div className="text-[22pt] font-bold leading-none">{t.fleetNumber}</div>
          {t.registration && <div className="text-[14pt] font-semibold leading-none">{t.registration}</div>}
          <QrImage svg={t.qrSvg} label={`QR code for ${t.fleetNumber}: ${t.url}`} sizeMm={42} />
          <figcaption className="text-center leading-tight">
            <div className="font-mono text-[16pt] font-bold tracking-[0.15em]" data-printed-code>
              {t.shortCode}
            </div>
            <div className="text-[8pt]">{t.typeCode} · scan, or type the fleet number</div>
          </figcaption>
        </figure>
      )}
    </PrintSheet>
  );
}
