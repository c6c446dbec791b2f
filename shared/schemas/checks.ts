import { z } from 'zod';
import { checkContextSchema, checkKindSchema, readingEntrySchema } from './limits';
import { pinSchema } from './auth';

export const checkReadingSchema = z
  .object({
    code: z.string().min(1).max(64),
    entry: readingEntrySchema,
  })
  .strict();

/** What the kiosk sends to sign a check. The id is made on the tablet and doubles as the idempotency key. */
export const submitCheckSchema = z
  .object({
    id: z.uuid({ message: 'The check id must be a UUID.' }),
    airframeId: z.number().int().positive(),
    kind: checkKindSchema,
    limitsVersionId: z.number().int().positive(),
    context: checkContextSchema,
    readings: z.array(checkReadingSchema).min(1, 'A check needs at least one reading.').max(100),
    note: z.string().trim().max(2000, 'A note is at most 2000 characters.').optional(),
    correctsCheckId: z.uuid().optional(),
    pin: pinSchema,
  })
  .strict();
export type SubmitCheck = z.infer<typeof submitCheckSchema>;

export const checkKindLabels = {
  pre_flight: 'Pre-flight',
  ground_run: 'Ground run',
  after_flight: 'After-flight',
  servicing: 'Servicing',
} as const;

export const verdictLabels = {
  in_limits: 'In limits',
  service: 'Service',
  out_of_limits: 'Out of limits',
} as const;
