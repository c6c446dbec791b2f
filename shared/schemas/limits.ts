import { z } from 'zod';
import { freeText } from './free-text';
import { toolKindSchema } from './tools';
import { withValues, type FieldKey } from '../i18n/validation';

/** The words of a limit definition that people read on the kiosk and in records ("The band message is missing."). */
const definitionText = (field: FieldKey) =>
  freeText(field, { min: 1, minMessage: withValues('words:validation.missing', { field }), max: 2000 });

import { pressureUnits, temperatureUnits, volumeUnits } from './unit-codes';

export * from './unit-codes';

export const unitSchema = z.enum([...pressureUnits, ...volumeUnits, ...temperatureUnits]);

export const verdictSchema = z.enum(['in_limits', 'service', 'out_of_limits']);
export type Verdict = z.infer<typeof verdictSchema>;

export const checkpointKindSchema = z.enum([
  'level',
  'pressure',
  'temperature',
  'yes_no',
  'quantity',
  'leak_rate',
]);
export type CheckpointKind = z.infer<typeof checkpointKindSchema>;

export const checkKindSchema = z.enum(['pre_flight', 'ground_run', 'after_flight', 'servicing']);
export type CheckKind = z.infer<typeof checkKindSchema>;

/** How the aircraft stands: which sight-glass mark applies depends on it. */
export const attitudeSchema = z.enum(['on_wheels', 'on_jacks_gear_retracted']);
export type Attitude = z.infer<typeof attitudeSchema>;

/** Whether hydraulic system pressure is on or relieved when the reading is taken. */
export const systemPressureSchema = z.enum(['on', 'relieved']);
export type SystemPressure = z.infer<typeof systemPressureSchema>;

// Strict: the context is signed, so a key the product does not know is refused rather than silently dropped.
export const checkContextSchema = z
  .object({
    attitude: attitudeSchema.optional(),
    systemPressure: systemPressureSchema.optional(),
    /** Ambient temperature in degrees C (canonical). */
    ambientTempC: z.number().min(-60).max(70).optional(),
  })
  .strict();
export type CheckContext = z.infer<typeof checkContextSchema>;

export const contextKeySchema = z.enum(['attitude', 'systemPressure', 'ambientTempC']);
export type ContextKey = z.infer<typeof contextKeySchema>;

/**
 * A leak is judged by its rate against the approved maintenance data, and a static seep (system not pressurised)
 * against other figures than a dynamic leak (system pressurised or operating).
 */
export const leakStateSchema = z.enum(['static', 'dynamic']);
export type LeakState = z.infer<typeof leakStateSchema>;

/**
 * A band applies only when every stated context value matches the reading's context. leakState is not a check
 * context: it comes with each leak-rate reading, and only a leak-rate checkpoint's bands may name it.
 */
export const bandConditionSchema = z.object({
  attitude: attitudeSchema.optional(),
  systemPressure: systemPressureSchema.optional(),
  leakState: leakStateSchema.optional(),
});
export type BandCondition = z.infer<typeof bandConditionSchema>;

/** A figure engineering types into the type editor; a figure it cannot read is refused in words. */
const figure = () => z.number({ error: 'words:validation.figure' });

/** One edge of a band, in the checkpoint's canonical unit. closed: the edge value itself belongs to the band. */
export const edgeSchema = z.object({ value: figure(), closed: z.boolean() });
export type Edge = z.infer<typeof edgeSchema>;

export const limitBandSchema = z.object({
  id: z.string().min(1),
  /** null: no lower edge (the gauge's physical range still bounds the value). */
  lower: edgeSchema.nullable(),
  upper: edgeSchema.nullable(),
  verdict: verdictSchema,
  message: definitionText('words:validation.field.bandMessage'),
  action: definitionText('words:validation.field.bandAction'),
  when: bandConditionSchema.optional(),
});
export type LimitBand = z.infer<typeof limitBandSchema>;

/** Marks drawn on a sight glass, in the checkpoint's canonical unit. */
export const levelMarksSchema = z.object({
  minimum: figure(),
  normal: figure(),
  /** The upper mark (for example the level that applies only with gear retracted on jacks). */
  maximum: figure(),
  /** Level below which a level switch isolates part of the system (drawn, not a mark to read against). */
  isolation: z.number().optional(),
});
export type LevelMarks = z.infer<typeof levelMarksSchema>;

export const levelPositionSchema = z.enum([
  'below_minimum',
  'at_minimum',
  'between_minimum_normal',
  'at_normal',
  'between_normal_maximum',
  'at_maximum',
  'above_maximum',
]);
export type LevelPosition = z.infer<typeof levelPositionSchema>;

/** Accumulator nitrogen pre-charge: the reference gauge pressure at a reference temperature, both in canonical units. */
export const prechargeSchema = z.object({
  referencePressure: z.number().positive(),
  referenceTempC: z.number(),
  tolerance: z.number().positive(),
});
export type Precharge = z.infer<typeof prechargeSchema>;

export const checkpointSchema = z.object({
  /** Stable within a type, e.g. "sys1.level". */
  code: z.string().regex(/^[a-z0-9]+(\.[a-z0-9_]+)*$/),
  label: definitionText('words:validation.field.checkpointLabel'),
  /** How to take the reading, shown on the kiosk. */
  instruction: definitionText('words:validation.field.instruction'),
  kind: checkpointKindSchema,
  /**
   * Canonical unit in which bands, marks, range and stored values are expressed; null for yes/no and for a leak
   * rate, which is always counted in drops per minute.
   */
  unit: unitSchema.nullable(),
  /**
   * The gauge's or glass's physical range; a value outside it is invalid input. For yes/no: 0..1. For a leak
   * rate: 0 (no leak) up to the most drops per minute a person can count.
   */
  range: z.object({ min: figure(), max: figure() }),
  /** Hydraulic system this checkpoint belongs to (for consumption and servicing), e.g. "sys1". */
  system: z.string().optional(),
  marks: levelMarksSchema.optional(),
  precharge: prechargeSchema.optional(),
  /** Context the reading must carry before it can be judged. */
  requires: z.array(contextKeySchema).default([]),
  /**
   * The only context in which a reading of this checkpoint means anything (for example a pump pressure with
   * system pressure on). A reading taken otherwise is refused as invalid input, not judged. Its keys are required.
   */
  takenWith: bandConditionSchema.optional(),
  /**
   * Ordered bands. For yes/no, value 1 is "yes" and 0 is "no". For a leak rate, drops per minute, usually with
   * when.leakState. Empty for a precharge checkpoint (bands are derived).
   */
  bands: z.array(limitBandSchema),
  /** ATA chapter, e.g. "29". */
  ata: z.string().min(2),
  /**
   * Work on a finding here disturbs something (for example flight controls) that a second person must inspect
   * before the release: EASA Part-145 AMC on error capturing (from memory).
   */
  independentInspection: z.boolean().optional(),
  /** Where the limit comes from in the operator's approved maintenance data. */
  reference: definitionText('words:validation.field.reference'),
  /**
   * The register's tools a reading here is taken with (for example a pressure gauge for a pre-charge), and whether
   * the reading is refused without one. Absent: no tool is asked.
   */
  tool: z
    .object({ kinds: z.array(toolKindSchema).min(1), required: z.boolean() })
    .strict()
    .optional(),
});
export type Checkpoint = z.infer<typeof checkpointSchema>;
export type CheckpointInput = z.input<typeof checkpointSchema>;

/**
 * A leak as counted: drops per minute (0 is "no leak", which needs no state) and whether it was static or dynamic.
 * Any number passes here so that the engine refuses a negative or fractional count with a plain message.
 */
const leakEntryShape = { dropsPerMinute: z.number(), leakState: leakStateSchema.optional() };

/** A reading as entered: a value with its unit, a position against the glass marks, a yes/no answer or a leak. */
export const readingEntrySchema = z.union([
  z.object({ value: z.number(), unit: unitSchema }).strict(),
  z.object({ position: levelPositionSchema }).strict(),
  z.object({ answer: z.boolean() }).strict(),
  z.object(leakEntryShape).strict(),
]);
export type ReadingEntry = z.infer<typeof readingEntrySchema>;

export type Reading = ReadingEntry & { context: CheckContext };

export const readingSchema = z.union([
  z.object({ value: z.number(), unit: unitSchema, context: checkContextSchema }).strict(),
  z.object({ position: levelPositionSchema, context: checkContextSchema }).strict(),
  z.object({ answer: z.boolean(), context: checkContextSchema }).strict(),
  z.object({ ...leakEntryShape, context: checkContextSchema }).strict(),
]);

export interface Evaluation {
  verdict: Verdict;
  band: LimitBand;
  message: string;
  action: string;
  /** The value judged, in the checkpoint's canonical unit, unrounded; absent for a position against the marks. */
  value?: number;
  /** For a pre-charge: the temperature-corrected expected gauge pressure, in the canonical unit, unrounded. */
  expected?: number;
}

export const fluidSchema = z.object({
  /** Specification name as printed on the can, e.g. "MIL-PRF-83282". */
  spec: definitionText('words:validation.field.fluidSpec'),
  /** Chemical base; fluids of different bases must not be mixed. */
  base: z.enum(['mineral', 'synthetic_hydrocarbon', 'phosphate_ester']),
});
export type Fluid = z.infer<typeof fluidSchema>;

export const validityWindowSchema = z.object({
  /** Hours a check of this kind stays valid after signing. */
  hours: z.number().positive().optional(),
  /** Valid until this local clock time ("HH:MM") at the latest, e.g. the end of the flying day. */
  untilLocalTime: z
    .string()
    .regex(/^\d{2}:\d{2}$/)
    .optional(),
  /** Valid for this many flights (e.g. a ground run covers one flight). */
  flights: z.number().int().positive().optional(),
});
export type ValidityWindow = z.infer<typeof validityWindowSchema>;

export const aircraftTypeDefinitionSchema = z.object({
  code: z.string().min(1),
  name: definitionText('words:validation.field.typeName'),
  fluid: z.object({ allowed: z.array(fluidSchema).min(1) }),
  systems: z.array(
    z.object({
      code: z.string(),
      label: definitionText('words:validation.field.systemLabel'),
      reservoirCheckpoint: z.string(),
    }),
  ),
  checkpoints: z.array(checkpointSchema).min(1),
  /** Which checkpoints each check kind asks, in order (codes from checkpoints). */
  cards: z.record(checkKindSchema, z.array(z.string()).min(1)),
  validity: z.record(checkKindSchema, validityWindowSchema),
  /** Consumption alert threshold: fluid added per flight hour, in litres. */
  consumptionAlertLPerFh: figure().positive({ error: 'words:validation.figureAboveZero' }),
  /** Local time zone of the type's operations, for "end of flying day" windows. */
  timeZone: z.string().default('UTC'),
});
export type AircraftTypeDefinition = z.infer<typeof aircraftTypeDefinitionSchema>;
export type AircraftTypeDefinitionInput = z.input<typeof aircraftTypeDefinitionSchema>;

/** Shown wherever limits are shown. */
export const limitsCaution =
  'Gaugewalk records and compares. Real limits come from the approved maintenance data of the aircraft, ' +
  'local regulations and licensed engineers.';
