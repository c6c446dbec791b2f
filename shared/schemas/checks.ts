import { z } from 'zod';
import { checkContextSchema, checkKindSchema, readingEntrySchema, volumeUnits } from './limits';
import { pinSchema } from './auth';
import { freeText } from './free-text';

export const photoIdsSchema = z.array(z.uuid()).max(6, 'At most 6 photos per reading.');

export const checkReadingSchema = z
  .object({
    code: z.string().min(1).max(64),
    entry: readingEntrySchema,
    photoIds: photoIdsSchema.optional(),
  })
  .strict();

/** Fluid added at a level checkpoint during the check; the reading sent for that checkpoint is the level re-read after. */
export const servicingEntrySchema = z
  .object({
    code: z.string().min(1).max(64),
    quantity: z
      .object({ value: z.number().positive('Enter the quantity added.').max(100), unit: z.enum(volumeUnits) })
      .strict(),
    fluidSpec: freeText('The fluid specification', {
      min: 1,
      minMessage: 'Pick the fluid specification.',
      max: 64,
    }),
    batch: z
      .string()
      .trim()
      .regex(
        /^[A-Za-z0-9][A-Za-z0-9 ./-]{0,39}$/,
        'A batch or lot number is 1 to 40 letters, digits, spaces, dots, dashes or slashes.',
      ),
    levelBefore: readingEntrySchema,
  })
  .strict();
export type ServicingEntryInput = z.infer<typeof servicingEntrySchema>;

/** What the kiosk sends to sign a check. The id is made on the tablet and doubles as the idempotency key. */
export const submitCheckSchema = z
  .object({
    id: z.uuid({ message: 'The check id must be a UUID.' }),
    airframeId: z.number().int().positive(),
    kind: checkKindSchema,
    limitsVersionId: z.number().int().positive(),
    context: checkContextSchema,
    readings: z.array(checkReadingSchema).min(1, 'A check needs at least one reading.').max(100),
    servicing: z.array(servicingEntrySchema).max(10).optional(),
    note: freeText('The note', { max: 2000, maxMessage: 'A note is at most 2000 characters.' }).optional(),
    correctsCheckId: z.uuid().optional(),
    pin: pinSchema,
  })
  .strict();
export type SubmitCheck = z.infer<typeof submitCheckSchema>;

/** How long a started, unsigned check keeps its airframe "in progress" after the tablet last touched it. */
export const draftLifetimeMs = 30 * 60_000;

export const checkDraftSchema = z
  .object({ id: z.uuid(), airframeId: z.number().int().positive(), kind: checkKindSchema })
  .strict();

export { checkKindLabels, verdictLabels } from './plain';
