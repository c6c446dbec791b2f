import { z } from 'zod';
import { isCalendarDate } from './calendar-date';
import { freeText } from './free-text';
import { withValues, type FieldKey } from '../i18n/validation';

/** What engineering keeps in the tools register: the instruments a reading or a top-up can be taken with. */
export const toolKindSchema = z.enum(['pressure_gauge', 'nitrogen_charging_kit', 'servicing_cart']);
export type ToolKind = z.infer<typeof toolKindSchema>;

export { toolKindLabels } from './plain';

/** The number painted on the tool and printed on its tag, e.g. "PG-014": capitals, digits and dashes. */
export const toolNumberSchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9][A-Z0-9-]{1,19}$/, 'words:validation.toolNumber');

/** A day ("YYYY-MM-DD") that exists; its message names the field (`field`). */
export const calendarDateSchema = (field: FieldKey) =>
  z.string().refine(isCalendarDate, withValues('words:validation.noSuchDayOf', { field }));

export const createToolSchema = z
  .object({
    number: toolNumberSchema,
    kind: toolKindSchema,
    description: freeText('words:validation.field.description', {
      min: 3,
      minMessage: 'words:validation.toolDescription',
      max: 200,
    }),
    serial: freeText('words:validation.field.toolSerial', {
      min: 1,
      minMessage: 'words:validation.toolSerial',
      max: 64,
    }),
    calibrationDue: calendarDateSchema('words:validation.field.calibrationDue'),
  })
  .strict();
export type CreateToolInput = z.infer<typeof createToolSchema>;

/** A new calibration certificate moves the due date; a description or serial typed wrong can be put right. */
export const updateToolSchema = createToolSchema
  .pick({ description: true, serial: true, calibrationDue: true })
  .partial()
  .strict();
export type UpdateToolInput = z.infer<typeof updateToolSchema>;

export interface Tool {
  id: number;
  number: string;
  kind: ToolKind;
  description: string;
  serial: string;
  /** "YYYY-MM-DD": the last day the tool may be used before it is calibrated again. */
  calibrationDue: string;
  retiredAt: string | null;
}

/** A tool as a signed check names it: the figures as they were at signing, whatever the register says later. */
export interface SignedTool {
  number: string;
  kind: ToolKind;
  description: string;
  serial: string;
  calibrationDue: string;
}

/** What a tool's QR tag encodes: the number behind a prefix, so an airframe tag or a stray code is told apart. */
export const toolTagPrefix = 'gaugewalk-tool:';
export const toolTagText = (number: string) => `${toolTagPrefix}${number}`;

/** The tool number a scanned tag carries, or null when the code is not a Gaugewalk tool tag. */
export function toolNumberFromTag(text: string): string | null {
  const trimmed = text.trim();
  if (!trimmed.toLowerCase().startsWith(toolTagPrefix)) return null;
  const parsed = toolNumberSchema.safeParse(trimmed.slice(toolTagPrefix.length));
  return parsed.success ? parsed.data : null;
}
