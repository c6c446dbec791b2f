import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import {
  createToolSchema,
  toolKindLabels,
  toolKindSchema,
  toolTagText,
  type CreateToolInput,
  type Tool,
} from '@shared/schemas/tools';
import { formatDay } from '@shared/domain/when';
import { localDay } from '@shared/domain/local-time';
import { DeskPage, Loading, Panel, ServerError, tableClass } from '@/components/desk/desk-ui';
import { Field, Input, Select, Options } from '@/components/desk/desk-form';
import { PrintSheet } from '@/components/desk/print-sheet';
import { QrCode } from '@/components/ui/qr-code';
import { Button } from '@/components/ui/button';
import { useTools } from '@/lib/shared-queries';
import { useRegisterTool, useRetireTool, useToolTags, useUpdateTool } from '../api/tools';

const today = () => localDay(new Date(), Intl.DateTimeFormat().resolvedOptions().timeZone);

/** The tool's calibration in words: a tool may be used up to and including its due date. */
function CalibrationState({ tool }: { tool: Tool }) {
  if (tool.retiredAt) return <span className="text-ink-muted">Retired</span>;
  const overdue = today() > tool.calibrationDue;
  return overdue ? (
    <span className="font-semibold text-warning-text">▲ Overdue since {formatDay(tool.calibrationDue)}</span>
  ) : (
    <span>● Due {formatDay(tool.calibrationDue)}</span>
  );
}

function RegisterToolForm() {
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
    <Panel title="Register a tool">
      <form
        noValidate
        className="grid grid-cols-[140px_220px_1fr_160px_180px_auto] items-start gap-3"
        onSubmit={(event) =>
          void handleSubmit((input) => save.mutate(input, { onSuccess: () => reset() }))(event)
        }
      >
        <Field label="Tool number" error={e.number?.message}>
          <Input {...register('number')} placeholder="PG-015" />
        </Field>
        <Field label="What it is" error={e.kind?.message}>
          <Select {...register('kind')}>
            <Options
              none="choose…"
              items={toolKindSchema.options}
              value={(k) => k}
              label={(k) => toolKindLabels[k]}
            />
          </Select>
        </Field>
        <Field label="What it measures" error={e.description?.message}>
          <Input {...register('description')} placeholder="Test gauge 0-250 bar, system pressure" />
        </Field>
        <Field label="Serial" error={e.serial?.message}>
          <Input {...register('serial')} />
        </Field>
        <Field label="Calibration due" error={e.calibrationDue?.message}>
          <Input type="date" {...register('calibrationDue')} />
        </Field>
        <div className="mt-6">
          <Button type="submit" tone="primary" disabled={save.isPending}>
            Register
          </Button>
        </div>
      </form>
      <ServerError error={save.error} title="Tool not registered" />
    </Panel>
  );
}

function ToolActions({ tool }: { tool: Tool }) {
  const update = useUpdateTool();
  const retire = useRetireTool();
  const [due, setDue] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  if (tool.retiredAt) return null;
  return (
    <div className="flex flex-wrap justify-end gap-2">
      {due === null ? (
        <Button className="h-8" onClick={() => setDue(tool.calibrationDue)}>
          New calibration
        </Button>
      ) : (
        <>
          <Input
            type="date"
            className="h-8 w-[170px]"
            aria-label={`Next calibration due for ${tool.number}`}
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
            Save date
          </Button>
          <Button className="h-8" tone="quiet" onClick={() => setDue(null)}>
            Cancel
          </Button>
        </>
      )}
      {confirming ? (
        <>
          <Button className="h-8" tone="stop" onClick={() => retire.mutate(tool.id)}>
            Retire {tool.number}
          </Button>
          <Button className="h-8" tone="quiet" onClick={() => setConfirming(false)}>
            Keep
          </Button>
        </>
      ) : (
        <Button className="h-8" onClick={() => setConfirming(true)}>
          Retire
        </Button>
      )}
      <Link className="inline-flex h-8 items-center underline" to={`/desk/tools/print?ids=${tool.id}`}>
        Print tag
      </Link>
      <ServerError error={update.error ?? retire.error} title={`${tool.number} not changed`} />
    </div>
  );
}

/** Engineering's register of gauges, nitrogen charging kits and servicing carts (Part-145 145.A.40, from memory). */
export function ToolsPage() {
  const tools = useTools();
  return (
    <DeskPage
      title="Tools and calibration"
      actions={
        <Link to="/desk/tools/print" className="underline">
          Print the tool tags
        </Link>
      }
    >
      <p className="text-ink-muted">
        A reading taken with a tool whose calibration is overdue on the day is refused at the kiosk. Retired
        tools stay listed: signed checks name them.
      </p>
      <RegisterToolForm />
      <Panel>
        {tools.isPending ? (
          <Loading what="tools" />
        ) : tools.isError ? (
          <ServerError error={tools.error} />
        ) : (
          <table className={tableClass} data-testid="tools-register">
            <thead>
              <tr>
                <th>Tool no.</th>
                <th>What it is</th>
                <th>What it measures</th>
                <th>Serial</th>
                <th>Calibration</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {tools.data.map((t) => (
                <tr key={t.id} className={t.retiredAt ? 'text-ink-muted' : ''}>
                  <td className="font-semibold">{t.number}</td>
                  <td>{toolKindLabels[t.kind]}</td>
                  <td>{t.description}</td>
                  <td>{t.serial}</td>
                  <td>
                    <CalibrationState tool={t} />
                  </td>
                  <td>
                    <ToolActions tool={t} />
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

/** One tag per tool in use: its number large, the QR code the kiosk scans, and what it is. */
export function ToolTagSheetPage() {
  return (
    <PrintSheet title="Tool tags" columns={4} what="tool tags" useItems={useToolTags}>
      {(t) => (
        <figure
          key={t.id}
          className="flex break-inside-avoid flex-col items-center gap-[1mm] rounded-[2mm] border-[0.4mm] border-black p-[3mm] [&_img]:h-[34mm] [&_img]:w-[34mm]"
          data-testid="tool-tag"
        >
          <div className="text-[20pt] font-bold leading-none">{t.number}</div>
          <QrCode url={toolTagText(t.number)} alt={`QR code for tool ${t.number}`} />
          <figcaption className="text-center text-[8pt] leading-tight">
            <div className="font-semibold">{toolKindLabels[t.kind]}</div>
            <div>Serial {t.serial}</div>
            <div>Calibration due {formatDay(t.calibrationDue)}</div>
          </figcaption>
        </figure>
      )}
    </PrintSheet>
  );
}
