import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import {
  createToolSchema,
  toolKindSchema,
  toolTagText,
  type CreateToolInput,
  type Tool,
} from '@shared/schemas/tools';
import { calendarDay } from '@/lib/when';
import { localDay } from '@shared/domain/local-time';
import { DeskPage, Loading, Panel, ServerError, DeskTable } from '@/components/desk/desk-ui';
import { Field, Input, Select, Options } from '@/components/desk/desk-form';
import { PrintSheet } from '@/components/desk/print-sheet';
import { QrCode } from '@/components/ui/qr-code';
import { Button } from '@/components/ui/button';
import { useTools } from '@/lib/shared-queries';
import { fieldError } from '@/lib/field-error';
import { useRegisterTool, useRetireTool, useToolTags, useUpdateTool } from '../api/tools';
import { toolKindLabel } from '@shared/schemas/plain';

const today = () => localDay(new Date(), Intl.DateTimeFormat().resolvedOptions().timeZone);

/** The tool's calibration in words: a tool may be used up to and including its due date. */
function CalibrationState({ tool }: { tool: Tool }) {
  const { t } = useTranslation('tools');
  if (tool.retiredAt) return <span className="text-ink-muted">{t('calibration.retired')}</span>;
  const overdue = today() > tool.calibrationDue;
  return overdue ? (
    <span className="font-semibold text-warning-text">
      {t('calibration.overdueSince', { day: calendarDay(tool.calibrationDue) })}
    </span>
  ) : (
    <span>{t('calibration.due', { day: calendarDay(tool.calibrationDue) })}</span>
  );
}

function RegisterToolForm() {
  const { t } = useTranslation('tools');
  const save = useRegisterTool();
  const { register, handleSubmit, formState, reset } = useForm<
    z.input<typeof createToolSchema>,
    unknown,
    CreateToolInput
  >({
    resolver: zodResolver(createToolSchema),
    defaultValues: { number: '', description: '', serial: '', calibrationDue: '' },
  });
  const e = formState.errors;
  return (
    <Panel title={t('register.title')}>
      <form
        noValidate
        className="grid grid-cols-2 items-start gap-3 sm:grid-cols-3 xl:grid-cols-[140px_220px_1fr_160px_180px_auto]"
        onSubmit={(event) =>
          void handleSubmit((input) => save.mutate(input, { onSuccess: () => reset() }))(event)
        }
      >
        <Field label={t('register.number')} error={fieldError(e.number?.message)}>
          <Input {...register('number')} placeholder={t('register.numberPlaceholder')} />
        </Field>
        <Field label={t('register.kind')} error={fieldError(e.kind?.message)}>
          <Select {...register('kind')}>
            <Options
              none={t('register.choose')}
              items={toolKindSchema.options}
              value={(k) => k}
              label={(k) => toolKindLabel(k)}
            />
          </Select>
        </Field>
        <Field label={t('register.description')} error={fieldError(e.description?.message)}>
          <Input {...register('description')} placeholder={t('register.descriptionPlaceholder')} />
        </Field>
        <Field label={t('register.serial')} error={fieldError(e.serial?.message)}>
          <Input {...register('serial')} />
        </Field>
        <Field label={t('register.calibrationDue')} error={fieldError(e.calibrationDue?.message)}>
          <Input type="date" {...register('calibrationDue')} />
        </Field>
        <div className="mt-6">
          <Button type="submit" tone="primary" disabled={save.isPending}>
            {t('register.submit')}
          </Button>
        </div>
      </form>
      <ServerError error={save.error} title={t('register.notRegistered')} />
    </Panel>
  );
}

function ToolActions({ tool }: { tool: Tool }) {
  const { t } = useTranslation('tools');
  const update = useUpdateTool();
  const retire = useRetireTool();
  const [due, setDue] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  if (tool.retiredAt) return null;
  return (
    <div className="flex flex-wrap justify-end gap-2">
      {due === null ? (
        <Button className="h-8" onClick={() => setDue(tool.calibrationDue)}>
          {t('actions.newCalibration')}
        </Button>
      ) : (
        <>
          <Input
            type="date"
            className="h-8 w-[170px]"
            aria-label={t('actions.nextDueLabel', { number: tool.number })}
            value={due}
            onChange={(event) => setDue(event.target.value)}
          />
          <Button
            className="h-8"
            tone="primary"
            onClick={() =>
              update.mutate(
                { id: tool.id, input: { calibrationDue: due } },
                { onSuccess: () => setDue(null) },
              )
            }
          >
            {t('actions.saveDate')}
          </Button>
          <Button className="h-8" tone="quiet" onClick={() => setDue(null)}>
            {t('actions.cancel')}
          </Button>
        </>
      )}
      {confirming ? (
        <>
          <Button className="h-8" tone="stop" onClick={() => retire.mutate(tool.id)}>
            {t('actions.confirmRetire', { number: tool.number })}
          </Button>
          <Button className="h-8" tone="quiet" onClick={() => setConfirming(false)}>
            {t('actions.keep')}
          </Button>
        </>
      ) : (
        <Button className="h-8" onClick={() => setConfirming(true)}>
          {t('actions.retire')}
        </Button>
      )}
      <Link className="inline-flex h-8 items-center underline" to={`/desk/tools/print?ids=${tool.id}`}>
        {t('actions.printTag')}
      </Link>
      <ServerError
        error={update.error ?? retire.error}
        title={t('actions.notChanged', { number: tool.number })}
      />
    </div>
  );
}

/** Engineering's register of gauges, nitrogen charging kits and servicing carts (Part-145 145.A.40, from memory). */
export function ToolsPage() {
  const { t } = useTranslation('tools');
  const tools = useTools();
  return (
    <DeskPage
      title={t('page.title')}
      actions={
        <Link to="/desk/tools/print" className="underline">
          {t('page.printTags')}
        </Link>
      }
    >
      <p className="text-ink-muted">{t('page.intro')}</p>
      <RegisterToolForm />
      <Panel>
        {tools.isPending ? (
          <Loading what={t('page.loadingWhat')} />
        ) : tools.isError ? (
          <ServerError error={tools.error} />
        ) : (
          <DeskTable data-testid="tools-register">
            <thead>
              <tr>
                <th>{t('table.number')}</th>
                <th>{t('table.kind')}</th>
                <th>{t('table.description')}</th>
                <th>{t('table.serial')}</th>
                <th>{t('table.calibration')}</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {tools.data.map((tool) => (
                <tr key={tool.id} className={tool.retiredAt ? 'text-ink-muted' : ''}>
                  <td className="font-semibold">{tool.number}</td>
                  <td>{toolKindLabel(tool.kind)}</td>
                  <td>{tool.description}</td>
                  <td>{tool.serial}</td>
                  <td>
                    <CalibrationState tool={tool} />
                  </td>
                  <td>
                    <ToolActions tool={tool} />
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

/** One tag per tool in use: its number large, the QR code the kiosk scans, and what it is. */
export function ToolTagSheetPage() {
  const { t: words } = useTranslation('tools');
  return (
    <PrintSheet title={words('sheet.title')} columns={4} what={words('sheet.what')} useItems={useToolTags}>
      {(t) => (
        <figure
          key={t.id}
          className="flex break-inside-avoid flex-col items-center gap-[1mm] rounded-[2mm] border-[0.4mm] border-black p-[3mm] [&_img]:h-[34mm] [&_img]:w-[34mm]"
          data-testid="tool-tag"
        >
          <div className="text-[20pt] font-bold leading-none">{t.number}</div>
          <QrCode url={toolTagText(t.number)} alt={words('sheet.qrAlt', { number: t.number })} />
          <figcaption className="text-center text-[8pt] leading-tight">
            <div className="font-semibold">{toolKindLabel(t.kind)}</div>
            <div>{words('sheet.serial', { serial: t.serial })}</div>
            <div>{words('sheet.calibrationDue', { day: calendarDay(t.calibrationDue) })}</div>
          </figcaption>
        </figure>
      )}
    </PrintSheet>
  );
}
