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
import type { TFunction } from 'i18next';
import { useTranslation } from 'react-i18next';
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
import {
  Field,
  Input,
  DecimalInput,
  Select,
  inputClass,
  Options,
  CheckboxSet,
} from '@/components/desk/desk-form';
import { fieldError } from '@/lib/field-error';
import { Button } from '@/components/ui/button';

type Form = AircraftTypeDefinitionInput;

type T = TFunction<'engineeringTypes'>;

const kindLabel = (t: T, kind: CheckpointKind) => t(`editor.checkpointKinds.${kind}`);

/** How an edge of a band is bounded: codes for the select, words from the catalogue. */
type EdgeKind = 'none' | 'closed' | 'open';
const EDGE_KINDS: readonly EdgeKind[] = ['none', 'closed', 'open'] as const;

/** The level marks, as codes; their words come from the catalogue. */
type Mark = 'minimum' | 'normal' | 'maximum';
const MARKS: readonly Mark[] = ['minimum', 'normal', 'maximum'] as const;

/** Glyphs, not words: the buttons and rows carrying them are named through the catalogue. */
const TAKE_OFF_GLYPH = '✕';
const OPEN_GLYPH = '▾';
const CLOSED_GLYPH = '▸';

/** Drops per minute a new leak-rate checkpoint counts up to: a drop a second is a running leak. */
const newLeakRangeMax = 60;

/**
 * Where a new leak-rate checkpoint starts: no leak in limits and any leak out of limits, for each state. The strictest
 * reading of the trade until engineering enters the allowed rates from the approved maintenance data.
 */
const strictLeakBands = (max: number, t: T): LimitBand[] =>
  leakStateSchema.options.flatMap((leakState) => [
    {
      id: `${leakState}_none`,
      lower: { value: 0, closed: true },
      upper: { value: 0, closed: true },
      verdict: 'in_limits' as const,
      message: t('editor.leak.noLeak'),
      action: t('editor.none'),
      when: { leakState },
    },
    {
      id: `${leakState}_leak`,
      lower: { value: 0, closed: false },
      upper: { value: max, closed: true },
      verdict: 'out_of_limits' as const,
      message: t(`editor.leak.${leakState}BeyondRate`),
      action: t('editor.leak.doNotFly'),
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
      out.push({ path: here, message: fieldError(value.message) });
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
  const { t } = useTranslation('engineeringTypes');
  const edgeKind: EdgeKind = value === null ? EDGE_KINDS[0]! : value.closed ? EDGE_KINDS[1]! : EDGE_KINDS[2]!;
  return (
    <div className="flex gap-1">
      {/* The desk's inputs are full width: the wrapper gives the kind its width, the figure takes the rest. */}
      <div className="w-[140px] shrink-0">
        <Select
          aria-label={t(`editor.edge.${side}Kind`)}
          value={edgeKind}
          onChange={(e) => {
            const kind = e.target.value;
            if (kind === 'none') return onChange(null);
            onChange({ value: value?.value ?? 0, closed: kind === 'closed' });
          }}
        >
          {EDGE_KINDS.map((k) => (
            <option key={k} value={k}>
              {k === 'none' ? t('editor.edge.none') : t(`editor.edge.${side}.${k}`)}
            </option>
          ))}
        </Select>
      </div>
      <DecimalInput
        aria-label={t(`editor.edge.${side}Value`)}
        className="min-w-0 flex-1"
        disabled={value === null}
        value={value?.value}
        onChange={(n) => onChange({ value: n ?? Number.NaN, closed: value?.closed ?? true })}
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
  const { t } = useTranslation('engineeringTypes');
  const bands = useFieldArray({ control, name: `checkpoints.${index}.bands` });
  const kind = useWatch({ control, name: `checkpoints.${index}.kind` });
  return (
    <div className="flex flex-col gap-2">
      <div className="flex items-center gap-3">
        <h4 className="mr-auto font-semibold">{t('editor.bands.title')}</h4>
        <Button
          onClick={() =>
            bands.append({
              id: `band_${bands.fields.length + 1}`,
              lower: null,
              upper: null,
              verdict: 'in_limits',
              message: '',
              action: t('editor.none'),
            })
          }
        >
          {t('editor.bands.add')}
        </Button>
      </div>
      {bands.fields.length === 0 && <p className="text-ink-muted">{t('editor.bands.noneFixed')}</p>}
      {bands.fields.map((band, b) => (
        <div key={band.id} className="flex flex-col gap-2 rounded-lg border border-ink-line p-2">
          <div className="grid grid-cols-2 items-end gap-2 lg:grid-cols-[130px_248px_248px_1fr_auto]">
            <Field label={t('editor.bands.id')}>
              <Input {...register(`checkpoints.${index}.bands.${b}.id`)} />
            </Field>
            <Field label={t('editor.bands.lower')}>
              <Controller
                control={control}
                name={`checkpoints.${index}.bands.${b}.lower`}
                render={({ field }) => (
                  <EdgeInput side="lower" value={field.value} onChange={field.onChange} />
                )}
              />
            </Field>
            <Field label={t('editor.bands.upper')}>
              <Controller
                control={control}
                name={`checkpoints.${index}.bands.${b}.upper`}
                render={({ field }) => (
                  <EdgeInput side="upper" value={field.value} onChange={field.onChange} />
                )}
              />
            </Field>
            <Field label={t('editor.bands.verdict')}>
              <Select {...register(`checkpoints.${index}.bands.${b}.verdict`)}>
                <Options items={verdictSchema.options} value={(v) => v} label={(v) => verdictLabels[v]} />
              </Select>
            </Field>
            <Button
              tone="quiet"
              aria-label={t('editor.bands.removeAria', { n: b + 1 })}
              onClick={() => bands.remove(b)}
            >
              {t('editor.bands.remove')}
            </Button>
          </div>
          <div className="grid grid-cols-1 gap-2 sm:grid-cols-2 xl:grid-cols-[1fr_1fr_190px_190px]">
            <Field label={t('editor.bands.message')}>
              <Input {...register(`checkpoints.${index}.bands.${b}.message`)} />
            </Field>
            <Field label={t('editor.bands.action')}>
              <Input {...register(`checkpoints.${index}.bands.${b}.action`)} />
            </Field>
            <Field label={t('editor.bands.whenAttitude')}>
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
                      none={t('editor.bands.any')}
                      items={attitudeSchema.options}
                      value={(a) => a}
                      label={(a) => t(`editor.attitudes.${a}`)}
                    />
                  </Select>
                )}
              />
            </Field>
            <Field label={t('editor.bands.whenPressure')}>
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
                      none={t('editor.bands.any')}
                      items={systemPressureSchema.options}
                      value={(p) => p}
                      label={(p) => t(`editor.systemPressures.${p}`)}
                    />
                  </Select>
                )}
              />
            </Field>
            {kind === 'leak_rate' && (
              <Field label={t('editor.bands.whenLeak')}>
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
                        none={t('editor.bands.staticOrDynamic')}
                        items={leakStateSchema.options}
                        value={(l) => l}
                        label={(l) => t(`editor.leakStates.${l}`)}
                      />
                    </Select>
                  )}
                />
              </Field>
            )}
          </div>
        </div>
      ))}
    </div>
  );
}

/** A checkpoint turned into a leak rate: counted in drops per minute from 0, and strict bands if it had none. */
function startLeakRate(setValue: UseFormSetValue<Form>, index: number, bandCount: number, t: T) {
  setValue(`checkpoints.${index}.unit`, null);
  setValue(`checkpoints.${index}.range`, { min: 0, max: newLeakRangeMax });
  if (bandCount === 0) setValue(`checkpoints.${index}.bands`, strictLeakBands(newLeakRangeMax, t));
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
  const { t } = useTranslation('engineeringTypes');
  const e = errors.checkpoints?.[index];
  const bandCount = useWatch({ control, name: `checkpoints.${index}.bands` })?.length ?? 0;
  return (
    <div className="flex flex-col gap-3">
      <div className="grid grid-cols-2 gap-3 lg:grid-cols-4">
        <Field
          label={t('editor.checkpoint.code')}
          error={fieldError(e?.code?.message)}
          hint={t('editor.checkpoint.codeHint')}
        >
          <Input {...register(`checkpoints.${index}.code`)} aria-invalid={e?.code ? true : undefined} />
        </Field>
        <Field
          label={t('editor.checkpoint.label')}
          error={fieldError(e?.label?.message)}
          className="col-span-2"
        >
          <Input {...register(`checkpoints.${index}.label`)} />
        </Field>
        <Field label={t('editor.checkpoint.kind')}>
          <Controller
            control={control}
            name={`checkpoints.${index}.kind`}
            render={({ field }) => (
              <Select
                value={field.value}
                onChange={(ev) => {
                  const kind = checkpointKindSchema.parse(ev.target.value);
                  field.onChange(kind);
                  if (kind === 'leak_rate') startLeakRate(setValue, index, bandCount, t);
                }}
              >
                <Options
                  items={checkpointKindSchema.options}
                  value={(k) => k}
                  label={(k) => kindLabel(t, k)}
                />
              </Select>
            )}
          />
        </Field>
        <Field
          label={t('editor.checkpoint.instruction')}
          error={fieldError(e?.instruction?.message)}
          className="col-span-2 lg:col-span-4"
        >
          <Input {...register(`checkpoints.${index}.instruction`)} />
        </Field>
        <Field label={t('editor.checkpoint.unit')}>
          <Controller
            control={control}
            name={`checkpoints.${index}.unit`}
            render={({ field }) => (
              <Select
                value={field.value ?? ''}
                onChange={(ev) => field.onChange(ev.target.value === '' ? null : ev.target.value)}
              >
                <Options
                  none={t('editor.checkpoint.noUnit')}
                  items={unitSchema.options}
                  value={(u) => u}
                  label={(u) => u}
                />
              </Select>
            )}
          />
        </Field>
        <Field label={t('editor.checkpoint.rangeMin')} error={fieldError(e?.range?.min?.message)}>
          <Controller
            control={control}
            name={`checkpoints.${index}.range.min`}
            render={({ field }) => (
              <DecimalInput value={field.value} onChange={(n) => field.onChange(n ?? Number.NaN)} />
            )}
          />
        </Field>
        <Field label={t('editor.checkpoint.rangeMax')} error={fieldError(e?.range?.max?.message)}>
          <Controller
            control={control}
            name={`checkpoints.${index}.range.max`}
            render={({ field }) => (
              <DecimalInput value={field.value} onChange={(n) => field.onChange(n ?? Number.NaN)} />
            )}
          />
        </Field>
        <Field label={t('editor.checkpoint.system')} hint={t('editor.checkpoint.systemHint')}>
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
        <Field label={t('editor.checkpoint.ata')} error={fieldError(e?.ata?.message)}>
          <Input {...register(`checkpoints.${index}.ata`)} />
        </Field>
        <Field label={t('editor.checkpoint.afterWork')} className="col-span-2">
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
                {t('editor.checkpoint.independentInspection')}
              </label>
            )}
          />
        </Field>
        <Field
          label={t('editor.checkpoint.reference')}
          error={fieldError(e?.reference?.message)}
          className="col-span-2 lg:col-span-3"
        >
          <Input
            {...register(`checkpoints.${index}.reference`)}
            placeholder={t('editor.checkpoint.referencePlaceholder')}
          />
        </Field>
        <Field label={t('editor.checkpoint.requires')} className="col-span-2">
          <Controller
            control={control}
            name={`checkpoints.${index}.requires`}
            render={({ field }) => (
              <CheckboxSet
                options={contextKeySchema.options}
                label={(key) => t(`editor.contextKeys.${key}`)}
                value={field.value ?? []}
                onChange={field.onChange}
              />
            )}
          />
        </Field>
        <Field
          label={t('editor.checkpoint.marks')}
          error={fieldError(
            e?.marks?.minimum?.message ?? e?.marks?.normal?.message ?? e?.marks?.maximum?.message,
          )}
          className="col-span-2"
        >
          <Controller
            control={control}
            name={`checkpoints.${index}.marks`}
            render={({ field }) => (
              <div className="flex gap-1">
                {MARKS.map((mark) => (
                  <DecimalInput
                    key={mark}
                    aria-label={t(`editor.checkpoint.mark.${mark}`)}
                    value={field.value?.[mark]}
                    onChange={(n) => {
                      if (n === undefined && mark === 'minimum' && !field.value) return;
                      const base = field.value ?? { minimum: 0, normal: 0, maximum: 0 };
                      field.onChange({ ...base, [mark]: n ?? Number.NaN });
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
          {t('editor.checkpoint.remove')}
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
  const { t } = useTranslation('engineeringTypes');
  const said = (code: string) => labels.get(code) ?? t('editor.cards.undefinedCheckpoint');
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
                <h4 className="font-semibold">{t('editor.cards.card', { kind: checkKindLabels[kind] })}</h4>
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
                        aria-label={t('editor.cards.moveUp', { checkpoint: said(code) })}
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
                        aria-label={t('editor.cards.moveDown', { checkpoint: said(code) })}
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
                        aria-label={t('editor.cards.takeOff', { checkpoint: said(code) })}
                        onClick={() => set(list.filter((_, j) => j !== i))}
                      >
                        {TAKE_OFF_GLYPH}
                      </Button>
                    </li>
                  ))}
                </ol>
                <Select
                  aria-label={t('editor.cards.addTo', { kind: checkKindLabels[kind] })}
                  value=""
                  onChange={(ev) => ev.target.value && set([...list, ev.target.value])}
                >
                  <option value="">{t('editor.cards.add')}</option>
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
  const { t } = useTranslation('engineeringTypes');
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
  const labels = new Map(checkpointList.map((c) => [c.code, c.label?.trim() || t('editor.cards.noLabel')]));
  const problems = flattenErrors(formState.errors);

  return (
    <form
      noValidate
      className="flex flex-col gap-4"
      onSubmit={(e) => void handleSubmit((values) => onSave(values))(e)}
    >
      <fieldset disabled={readOnly} className="flex flex-col gap-4">
        <Panel title={t('editor.type.title')}>
          <div className="grid grid-cols-2 gap-3 lg:grid-cols-4">
            <Field label={t('editor.type.code')}>
              <Input value={initial.code} readOnly disabled />
            </Field>
            <Field
              label={t('editor.type.name')}
              error={fieldError(formState.errors.name?.message)}
              className="col-span-2"
            >
              <Input {...register('name')} />
            </Field>
            <Field label={t('editor.type.timeZone')} hint={t('editor.type.timeZoneHint')}>
              <Input {...register('timeZone')} />
            </Field>
            <Field
              label={t('editor.type.consumptionAlert')}
              error={fieldError(formState.errors.consumptionAlertLPerFh?.message)}
            >
              <Controller
                control={control}
                name="consumptionAlertLPerFh"
                render={({ field }) => (
                  <DecimalInput value={field.value} onChange={(n) => field.onChange(n ?? Number.NaN)} />
                )}
              />
            </Field>
            <Field
              label={t('editor.type.settings')}
              error={settingsError ?? undefined}
              className="col-span-2 lg:col-span-3"
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
                        parsed.error.issues
                          .map((i) => `${i.path.join('.')}: ${fieldError(i.message)}`)
                          .join('; '),
                      );
                    setSettingsError(null);
                    setValue('fluid', parsed.data.fluid);
                    setValue('systems', parsed.data.systems);
                    setValue('validity', parsed.data.validity);
                  } catch {
                    setSettingsError(t('editor.type.invalidJson'));
                  }
                }}
              />
            </Field>
          </div>
        </Panel>
        <Panel
          title={t('editor.checkpoints.title', { count: checkpoints.fields.length })}
          actions={
            <Button
              onClick={() => {
                checkpoints.append({
                  code: `new${checkpoints.fields.length + 1}`,
                  label: t('editor.checkpoints.newLabel'),
                  instruction: t('editor.checkpoints.newInstruction'),
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
              {t('editor.checkpoints.add')}
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
                    <span aria-hidden>{open === i ? OPEN_GLYPH : CLOSED_GLYPH}</span>
                    <span className="mr-auto">{watch(`checkpoints.${i}.label`)}</span>
                    <span className="text-ink-muted">
                      {t('editor.checkpoints.summary', {
                        kind: kindLabel(t, watch(`checkpoints.${i}.kind`)),
                        ata: watch(`checkpoints.${i}.ata`),
                        bands: watch(`checkpoints.${i}.bands`)?.length ?? 0,
                      })}
                    </span>
                    {hasError && (
                      <span className="font-bold text-warning-text">{t('editor.checkpoints.needsLook')}</span>
                    )}
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
        <Panel title={t('editor.cards.title')}>
          <CardEditor control={control} codes={codes} labels={labels} />
        </Panel>
      </fieldset>
      {problems.length > 0 && (
        <div role="alert" className="rounded-lg border-2 border-warning-edge bg-ink-soft p-3">
          <p className="font-bold">{t('editor.problems.title')}</p>
          <ul className="list-disc pl-6">
            {problems.map((p) => (
              <li key={p.path}>
                <span className="font-mono text-[15px]">{p.path}</span>: {p.message}
              </li>
            ))}
          </ul>
        </div>
      )}
      <ServerError error={saveError} title={t('editor.notSaved')} />
      {!readOnly && (
        <div className="flex gap-3">
          <Button type="submit" tone="primary" disabled={saving || settingsError !== null}>
            {saving ? t('editor.saving') : t('editor.save')}
          </Button>
        </div>
      )}
    </form>
  );
}
