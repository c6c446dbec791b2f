import { useState } from 'react';
import {
  Controller,
  useFieldArray,
  useForm,
  useWatch,
  type Control,
  type FieldErrors,
  type UseFormRegister,
  type UseFormSetValue,
} from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  aircraftTypeDefinitionSchema,
  attitudeSchema,
  checkKindSchema,
  checkpointKindSchema,
  contextKeySchema,
  leakStateSchema,
  systemPressureSchema,
  unitSchema,
  verdictSchema,
  type AircraftTypeDefinition,
  type AircraftTypeDefinitionInput,
  type CheckpointKind,
  type Edge,
  type LimitBand,
} from '@shared/schemas/limits';
import { checkKindLabels, verdictLabels } from '@shared/schemas/plain';
import { Panel, ServerError } from '@/components/desk/desk-ui';
import { Field, Input, Select, inputClass, Options, CheckboxSet } from '@/components/desk/desk-form';
import { Button } from '@/components/ui/button';

type Form = AircraftTypeDefinitionInput;

const kindLabels: Record<CheckpointKind, string> = {
  level: 'level (sight glass)',
  pressure: 'pressure',
  temperature: 'temperature',
  yes_no: 'yes/no',
  quantity: 'quantity',
  leak_rate: 'leak rate (drops/min)',
};

const leakStateLabels = {
  static: 'static (system not pressurised)',
  dynamic: 'dynamic (system pressurised or operating)',
} as const;

/** Drops per minute a new leak-rate checkpoint counts up to: a drop a second is a running leak. */
const newLeakRangeMax = 60;

/**
 * Where a new leak-rate checkpoint starts: no leak in limits and any leak out of limits, for each state. The strictest
 * reading of the trade until engineering enters the allowed rates from the approved maintenance data.
 */
const strictLeakBands = (max: number): LimitBand[] =>
  leakStateSchema.options.flatMap((leakState) => [
    {
      id: `${leakState}_none`,
      lower: { value: 0, closed: true },
      upper: { value: 0, closed: true },
      verdict: 'in_limits' as const,
      message: 'No leak.',
      action: 'None.',
      when: { leakState },
    },
    {
      id: `${leakState}_leak`,
      lower: { value: 0, closed: false },
      upper: { value: max, closed: true },
      verdict: 'out_of_limits' as const,
      message: `${leakState === 'static' ? 'Static' : 'Dynamic'} leak beyond the allowed rate.`,
      action: 'Do not fly. Mark the leak, put the aircraft on hold and tell the shift lead.',
      when: { leakState },
    },
  ]);

/** Every message zod gave, with where it is, so nothing wrong hides in a folded checkpoint. */
function flattenErrors(errors: FieldErrors, path = ''): { path: string; message: string }[] {
  const out: { path: string; message: string }[] = [];
  for (const [key, value] of Object.entries(errors)) {
    if (!value || key === 'ref') continue;
    const here = path ? `${path}.${key}` : key;
    if (typeof value === 'object' && 'message' in value && typeof value.message === 'string') {
      out.push({ path: here, message: value.message });
    } else if (typeof value === 'object') out.push(...flattenErrors(value as FieldErrors, here));
  }
  return out;
}

function EdgeInput({
  value,
  onChange,
  side,
}: {
  value: Edge | null;
  onChange: (e: Edge | null) => void;
  side: 'lower' | 'upper';
}) {
  const [text, setText] = useState(value === null ? '' : String(value.value));
  return (
    <div className="flex gap-1">
      <Select
        aria-label={`${side} edge kind`}
        className="w-[92px]"
        value={value === null ? 'none' : value.closed ? 'closed' : 'open'}
        onChange={(e) => {
          const kind = e.target.value;
          if (kind === 'none') return onChange(null);
          onChange({ value: value?.value ?? (Number(text) || 0), closed: kind === 'closed' });
        }}
      >
        <option value="none">none</option>
        <option value="closed">{side === 'lower' ? '≥ closed' : '≤ closed'}</option>
        <option value="open">{side === 'lower' ? '> open' : '< open'}</option>
      </Select>
      <Input
        aria-label={`${side} edge value`}
        className="w-[90px] tabular"
        inputMode="decimal"
        disabled={value === null}
        value={value === null ? '' : text}
        onChange={(e) => {
          setText(e.target.value);
          const n = Number(e.target.value);
          if (e.target.value.trim() !== '' && Number.isFinite(n))
            onChange({ value: n, closed: value?.closed ?? true });
        }}
      />
    </div>
  );
}

function Bands({
  control,
  register,
  index,
}: {
  control: Control<Form>;
  register: UseFormRegister<Form>;
  index: number;
}) {
  const bands = useFieldArray({ control, name: `checkpoints.${index}.bands` });
  const kind = useWatch({ control, name: `checkpoints.${index}.kind` });
  return (
    <div className="flex flex-col gap-2">
      <div className="flex items-center gap-3">
        <h4 className="mr-auto font-semibold">Limit bands</h4>
        <Button
          onClick={() =>
            bands.append({
              id: `band_${bands.fields.length + 1}`,
              lower: null,
              upper: null,
              verdict: 'in_limits',
              message: '',
              action: 'None.',
            })
          }
        >
          Add band
        </Button>
      </div>
      {bands.fields.length === 0 && (
        <p className="text-ink-muted">No fixed bands (a pre-charge derives its bands).</p>
      )}
      {bands.fields.map((band, b) => (
        <div
          key={band.id}
          className="grid grid-cols-[130px_200px_200px_150px_1fr_auto] items-end gap-2 rounded-lg border border-ink-line p-2"
        >
          <Field label="Band id">
            <Input {...register(`checkpoints.${index}.bands.${b}.id`)} />
          </Field>
          <Field label="Lower edge">
            <Controller
              control={control}
              name={`checkpoints.${index}.bands.${b}.lower`}
              render={({ field }) => <EdgeInput side="lower" value={field.value} onChange={field.onChange} />}
            />
          </Field>
          <Field label="Upper edge">
            <Controller
              control={control}
              name={`checkpoints.${index}.bands.${b}.upper`}
              render={({ field }) => <EdgeInput side="upper" value={field.value} onChange={field.onChange} />}
            />
          </Field>
          <Field label="Verdict">
            <Select {...register(`checkpoints.${index}.bands.${b}.verdict`)}>
              <Options items={verdictSchema.options} value={(v) => v} label={(v) => verdictLabels[v]} />
            </Select>
          </Field>
          <div className="grid grid-cols-2 gap-2">
            <Field label="Message">
              <Input {...register(`checkpoints.${index}.bands.${b}.message`)} />
            </Field>
            <Field label="Action">
              <Input {...register(`checkpoints.${index}.bands.${b}.action`)} />
            </Field>
            <Field label="Only when attitude">
              <Controller
                control={control}
                name={`checkpoints.${index}.bands.${b}.when`}
                render={({ field }) => (
                  <Select
                    value={field.value?.attitude ?? ''}
                    onChange={(e) => {
                      const { attitude: _a, ...rest } = field.value ?? {};
                      const next = e.target.value
                        ? { ...rest, attitude: attitudeSchema.parse(e.target.value) }
                        : rest;
                      field.onChange(Object.keys(next).length ? next : undefined);
                    }}
                  >
                    <Options
                      none="any"
                      items={attitudeSchema.options}
                      value={(a) => a}
                      label={(a) => a.replaceAll('_', ' ')}
                    />
                  </Select>
                )}
              />
            </Field>
            <Field label="Only when system pressure">
              <Controller
                control={control}
                name={`checkpoints.${index}.bands.${b}.when`}
                render={({ field }) => (
                  <Select
                    value={field.value?.systemPressure ?? ''}
                    onChange={(e) => {
                      const { systemPressure: _p, ...rest } = field.value ?? {};
                      const next = e.target.value
                        ? { ...rest, systemPressure: systemPressureSchema.parse(e.target.value) }
                        : rest;
                      field.onChange(Object.keys(next).length ? next : undefined);
                    }}
                  >
                    <Options
                      none="any"
                      items={systemPressureSchema.options}
                      value={(p) => p}
                      label={(p) => p}
                    />
                  </Select>
                )}
              />
            </Field>
            {kind === 'leak_rate' && (
              <Field label="Only for a leak that is">
                <Controller
                  control={control}
                  name={`checkpoints.${index}.bands.${b}.when`}
                  render={({ field }) => (
                    <Select
                      value={field.value?.leakState ?? ''}
                      onChange={(e) => {
                        const { leakState: _l, ...rest } = field.value ?? {};
                        const next = e.target.value
                          ? { ...rest, leakState: leakStateSchema.parse(e.target.value) }
                          : rest;
                        field.onChange(Object.keys(next).length ? next : undefined);
                      }}
                    >
                      <Options
                        none="static or dynamic"
                        items={leakStateSchema.options}
                        value={(l) => l}
                        label={(l) => leakStateLabels[l]}
                      />
                    </Select>
                  )}
                />
              </Field>
            )}
          </div>
          <Button tone="quiet" aria-label={`Remove band ${b + 1}`} onClick={() => bands.remove(b)}>
            Remove
          </Button>
        </div>
      ))}
    </div>
  );
}

const num = { valueAsNumber: true } as const;

/** A checkpoint turned into a leak rate: counted in drops per minute from 0, and strict bands if it had none. */
function startLeakRate(setValue: UseFormSetValue<Form>, index: number, bandCount: number) {
  setValue(`checkpoints.${index}.unit`, null);
  setValue(`checkpoints.${index}.range`, { min: 0, max: newLeakRangeMax });
  if (bandCount === 0) setValue(`checkpoints.${index}.bands`, strictLeakBands(newLeakRangeMax));
}

function CheckpointEditor({
  control,
  register,
  setValue,
  index,
  errors,
  onRemove,
}: {
  control: Control<Form>;
  register: UseFormRegister<Form>;
  setValue: UseFormSetValue<Form>;
  index: number;
  errors: FieldErrors<Form>;
  onRemove: () => void;
}) {
  const e = errors.checkpoints?.[index];
  const bandCount = useWatch({ control, name: `checkpoints.${index}.bands` })?.length ?? 0;
  return (
    <div className="flex flex-col gap-3">
      <div className="grid grid-cols-4 gap-3">
        <Field label="Code" error={e?.code?.message} hint="e.g. sys1.level">
          <Input {...register(`checkpoints.${index}.code`)} aria-invalid={e?.code ? true : undefined} />
        </Field>
        <Field label="Label" error={e?.label?.message} className="col-span-2">
          <Input {...register(`checkpoints.${index}.label`)} />
        </Field>
        <Field label="Kind">
          <Controller
            control={control}
            name={`checkpoints.${index}.kind`}
            render={({ field }) => (
              <Select
                value={field.value}
                onChange={(ev) => {
                  const kind = checkpointKindSchema.parse(ev.target.value);
                  field.onChange(kind);
                  if (kind === 'leak_rate') startLeakRate(setValue, index, bandCount);
                }}
              >
                <Options items={checkpointKindSchema.options} value={(k) => k} label={(k) => kindLabels[k]} />
              </Select>
            )}
          />
        </Field>
        <Field label="Instruction on the kiosk" error={e?.instruction?.message} className="col-span-4">
          <Input {...register(`checkpoints.${index}.instruction`)} />
        </Field>
        <Field label="Canonical unit">
          <Controller
            control={control}
            name={`checkpoints.${index}.unit`}
            render={({ field }) => (
              <Select
                value={field.value ?? ''}
                onChange={(ev) => field.onChange(ev.target.value === '' ? null : ev.target.value)}
              >
                <Options
                  none="none (yes/no, leak rate)"
                  items={unitSchema.options}
                  value={(u) => u}
                  label={(u) => u}
                />
              </Select>
            )}
          />
        </Field>
        <Field label="Range min" error={e?.range?.min?.message}>
          <Input inputMode="decimal" {...register(`checkpoints.${index}.range.min`, num)} />
        </Field>
        <Field label="Range max" error={e?.range?.max?.message}>
          <Input inputMode="decimal" {...register(`checkpoints.${index}.range.max`, num)} />
        </Field>
        <Field label="System" hint="for consumption, e.g. sys1">
          <Controller
            control={control}
            name={`checkpoints.${index}.system`}
            render={({ field }) => (
              <Input
                value={field.value ?? ''}
                onChange={(ev) => field.onChange(ev.target.value === '' ? undefined : ev.target.value)}
              />
            )}
          />
        </Field>
        <Field label="ATA chapter" error={e?.ata?.message}>
          <Input {...register(`checkpoints.${index}.ata`)} />
        </Field>
        <Field label="After work on a finding here" className="col-span-2">
          <Controller
            control={control}
            name={`checkpoints.${index}.independentInspection`}
            render={({ field }) => (
              <label className="flex h-10 items-center gap-2">
                <input
                  type="checkbox"
                  className="size-5"
                  checked={field.value === true}
                  onChange={(ev) => field.onChange(ev.target.checked ? true : undefined)}
                />
                a second person inspects before the release (for example flight controls disturbed)
              </label>
            )}
          />
        </Field>
        <Field label="Reference in the approved data" error={e?.reference?.message} className="col-span-3">
          <Input
            {...register(`checkpoints.${index}.reference`)}
            placeholder="AMM chapter, task and revision"
          />
        </Field>
        <Field label="Reading needs" className="col-span-2">
          <Controller
            control={control}
            name={`checkpoints.${index}.requires`}
            render={({ field }) => (
              <CheckboxSet
                options={contextKeySchema.options}
                value={field.value ?? []}
                onChange={field.onChange}
              />
            )}
          />
        </Field>
        <Field label="Marks (level): min / normal / max" className="col-span-2">
          <Controller
            control={control}
            name={`checkpoints.${index}.marks`}
            render={({ field }) => (
              <div className="flex gap-1">
                {(['minimum', 'normal', 'maximum'] as const).map((mark) => (
                  <input
                    key={mark}
                    aria-label={`${mark} mark`}
                    className={`${inputClass} tabular`}
                    inputMode="decimal"
                    defaultValue={field.value?.[mark] ?? ''}
                    onChange={(ev) => {
                      const n = Number(ev.target.value);
                      if (ev.target.value === '' && mark === 'minimum' && !field.value) return;
                      const base = field.value ?? { minimum: 0, normal: 0, maximum: 0 };
                      field.onChange({ ...base, [mark]: Number.isFinite(n) ? n : base[mark] });
                    }}
                  />
                ))}
              </div>
            )}
          />
        </Field>
      </div>
      <Bands control={control} register={register} index={index} />
      <div>
        <Button tone="stop" onClick={onRemove}>
          Remove this checkpoint
        </Button>
      </div>
    </div>
  );
}

function CardEditor({
  control,
  codes,
  labels,
}: {
  control: Control<Form>;
  codes: string[];
  labels: ReadonlyMap<string, string>;
}) {
  const said = (code: string) => labels.get(code) ?? 'a checkpoint that is no longer defined';
  return (
    <Controller
      control={control}
      name="cards"
      render={({ field }) => (
        <div className="grid grid-cols-2 gap-3">
          {checkKindSchema.options.map((kind) => {
            const list = field.value?.[kind] ?? [];
            const set = (next: string[]) => {
              const cards = { ...(field.value ?? {}) };
              if (next.length) cards[kind] = next;
              else delete cards[kind];
              field.onChange(cards);
            };
            return (
              <div key={kind} className="rounded-lg border border-ink-line p-2">
                <h4 className="font-semibold">{checkKindLabels[kind]} card</h4>
                <ol className="my-1 flex flex-col gap-1">
                  {list.map((code, i) => (
                    <li key={`${code}-${i}`} className="flex items-center gap-2">
                      <span className="w-6 text-right tabular text-ink-muted">{i + 1}.</span>
                      <span className={`mr-auto ${codes.includes(code) ? '' : 'text-warning-text'}`}>
                        {said(code)}
                      </span>
                      <Button
                        tone="quiet"
                        className="h-8 px-2"
                        aria-label={`Move ${said(code)} up`}
                        disabled={i === 0}
                        onClick={() =>
                          set(list.map((c, j) => (j === i - 1 ? code : j === i ? list[i - 1]! : c)))
                        }
                      >
                        ↑
                      </Button>
                      <Button
                        tone="quiet"
                        className="h-8 px-2"
                        aria-label={`Move ${said(code)} down`}
                        disabled={i === list.length - 1}
                        onClick={() =>
                          set(list.map((c, j) => (j === i + 1 ? code : j === i ? list[i + 1]! : c)))
                        }
                      >
                        ↓
                      </Button>
                      <Button
                        tone="quiet"
                        className="h-8 px-2"
                        aria-label={`Take ${said(code)} off the card`}
                        onClick={() => set(list.filter((_, j) => j !== i))}
                      >
                        ✕
                      </Button>
                    </li>
                  ))}
                </ol>
                <Select
                  aria-label={`Add a checkpoint to the ${checkKindLabels[kind]} card`}
                  value=""
                  onChange={(ev) => ev.target.value && set([...list, ev.target.value])}
                >
                  <option value="">Add a checkpoint…</option>
                  {codes
                    .filter((c) => !list.includes(c))
                    .map((c) => (
                      <option key={c} value={c}>
                        {said(c)}
                      </option>
                    ))}
                </Select>
              </div>
            );
          })}
        </div>
      )}
    />
  );
}

const settingsSchema = aircraftTypeDefinitionSchema.pick({ fluid: true, systems: true, validity: true });

/**
 * The whole type as one form, validated with the server's own schema. Saving stores a draft; gaps and overlaps
 * are the server's to refuse at publication, with the bands named.
 */
export function TypeEditor({
  initial,
  saving,
  saveError,
  onSave,
  readOnly,
}: {
  initial: AircraftTypeDefinition;
  saving: boolean;
  saveError: unknown;
  onSave: (definition: AircraftTypeDefinition) => void;
  readOnly: boolean;
}) {
  const { control, register, handleSubmit, watch, formState, setValue } = useForm<
    Form,
    unknown,
    AircraftTypeDefinition
  >({
    resolver: zodResolver(aircraftTypeDefinitionSchema),
    defaultValues: initial,
  });
  const checkpoints = useFieldArray({ control, name: 'checkpoints' });
  const [open, setOpen] = useState<number | null>(null);
  const [settingsText, setSettingsText] = useState(() =>
    JSON.stringify({ fluid: initial.fluid, systems: initial.systems, validity: initial.validity }, null, 2),
  );
  const [settingsError, setSettingsError] = useState<string | null>(null);
  const checkpointList = watch('checkpoints') ?? [];
  const codes = checkpointList.map((c) => c.code);
  // Cards list checkpoints by their label: the code is the program's key, which engineering edits in its own field.
  const labels = new Map(
    checkpointList.map((c) => [c.code, c.label?.trim() || 'A checkpoint with no label yet']),
  );
  const problems = flattenErrors(formState.errors);

  return (
    <form
      noValidate
      className="flex flex-col gap-4"
      onSubmit={(e) => void handleSubmit((values) => onSave(values))(e)}
    >
      <fieldset disabled={readOnly} className="flex flex-col gap-4">
        <Panel title="Type">
          <div className="grid grid-cols-4 gap-3">
            <Field label="Code">
              <Input value={initial.code} readOnly disabled />
            </Field>
            <Field label="Name" error={formState.errors.name?.message} className="col-span-2">
              <Input {...register('name')} />
            </Field>
            <Field label="Time zone" hint="for end-of-day validity">
              <Input {...register('timeZone')} />
            </Field>
            <Field
              label="Consumption alert, L per flight hour"
              error={formState.errors.consumptionAlertLPerFh?.message}
            >
              <Input inputMode="decimal" {...register('consumptionAlertLPerFh', num)} />
            </Field>
            <Field
              label="Fluids, systems and validity windows (JSON)"
              error={settingsError ?? undefined}
              className="col-span-3"
            >
              <textarea
                className={`${inputClass} h-40 font-mono text-[14px]`}
                value={settingsText}
                spellCheck={false}
                onChange={(ev) => {
                  setSettingsText(ev.target.value);
                  try {
                    const parsed = settingsSchema.safeParse(JSON.parse(ev.target.value));
                    if (!parsed.success)
                      return setSettingsError(
                        parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; '),
                      );
                    setSettingsError(null);
                    setValue('fluid', parsed.data.fluid);
                    setValue('systems', parsed.data.systems);
                    setValue('validity', parsed.data.validity);
                  } catch {
                    setSettingsError('This is not valid JSON yet.');
                  }
                }}
              />
            </Field>
          </div>
        </Panel>
        <Panel
          title={`Checkpoints (${checkpoints.fields.length})`}
          actions={
            <Button
              onClick={() => {
                checkpoints.append({
                  code: `new${checkpoints.fields.length + 1}`,
                  label: 'New checkpoint',
                  instruction: 'Describe how to take the reading.',
                  kind: 'yes_no',
                  unit: null,
                  range: { min: 0, max: 1 },
                  requires: [],
                  bands: [],
                  ata: '29',
                  reference: '',
                });
                setOpen(checkpoints.fields.length);
              }}
            >
              Add checkpoint
            </Button>
          }
        >
          <ul className="flex flex-col gap-2">
            {checkpoints.fields.map((cp, i) => {
              const hasError = Boolean(formState.errors.checkpoints?.[i]);
              return (
                <li
                  key={cp.id}
                  className={`rounded-lg border-2 ${hasError ? 'border-warning-edge' : 'border-ink-line'} bg-ink`}
                >
                  <button
                    type="button"
                    className="flex w-full items-center gap-3 px-3 py-2 text-left"
                    aria-expanded={open === i}
                    onClick={() => setOpen(open === i ? null : i)}
                  >
                    <span aria-hidden>{open === i ? '▾' : '▸'}</span>
                    <span className="mr-auto">{watch(`checkpoints.${i}.label`)}</span>
                    <span className="text-ink-muted">
                      {kindLabels[watch(`checkpoints.${i}.kind`)]} · ATA {watch(`checkpoints.${i}.ata`)} ·{' '}
                      {watch(`checkpoints.${i}.bands`)?.length ?? 0} bands
                    </span>
                    {hasError && <span className="font-bold text-warning-text">⚠ needs a look</span>}
                  </button>
                  {open === i && (
                    <div className="border-t border-ink-line p-3">
                      <CheckpointEditor
                        control={control}
                        register={register}
                        setValue={setValue}
                        index={i}
                        errors={formState.errors}
                        onRemove={() => {
                          checkpoints.remove(i);
                          setOpen(null);
                        }}
                      />
                    </div>
                  )}
                </li>
              );
            })}
          </ul>
        </Panel>
        <Panel title="Check cards: what each check kind asks, in order">
          <CardEditor control={control} codes={codes} labels={labels} />
        </Panel>
      </fieldset>
      {problems.length > 0 && (
        <div role="alert" className="rounded-lg border-2 border-warning-edge bg-ink-soft p-3">
          <p className="font-bold">Not saved: fix these first.</p>
          <ul className="list-disc pl-6">
            {problems.map((p) => (
              <li key={p.path}>
                <span className="font-mono text-[15px]">{p.path}</span>: {p.message}
              </li>
            ))}
          </ul>
        </div>
      )}
      <ServerError error={saveError} title="Draft not saved" />
      {!readOnly && (
        <div className="flex gap-3">
          <Button type="submit" tone="primary" disabled={saving || settingsError !== null}>
            {saving ? 'Saving…' : 'Save draft'}
          </Button>
        </div>
      )}
    </form>
  );
}
